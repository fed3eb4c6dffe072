package org.skyrota.web.request;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;

import org.flywaydb.core.Flyway;
import org.flywaydb.core.api.configuration.FluentConfiguration;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.skyrota.web.support.EnabledIfPostgresReachable;
import org.skyrota.web.support.LocalPostgres;

/**
 * A database written by the version that stored priority 1 as the highest is migrated so that every request keeps
 * its meaning under 1 = lowest, 5 = highest (the planner's {@code Request.priority}), and gains empty repeat-spacing
 * columns. The schema is built by Flyway up to V4 exactly as that version left it, rows are written with plain SQL,
 * then the rest of the migrations run: on the embedded H2 always, and on PostgreSQL when it answers.
 */
class RequestMigrationTest {

    /** Migrates to V4, stores old rows, migrates to the newest; answers (priority, interval, tolerance) by id. */
    static List<Object[]> migrateOldRows(FluentConfiguration flyway, String url, String user, String password)
            throws SQLException {
        flyway.locations("classpath:db/migration").target("4").load().migrate();
        try (Connection c = DriverManager.getConnection(url, user, password); Statement s = c.createStatement()) {
            s.executeUpdate("insert into program (version, code, title, principal_investigator, active, created_at, updated_at)"
                    + " values (0, 'OLD-1', 'Stored by the earlier version', 'Dr. Test', true, current_timestamp, current_timestamp)");
            for (int old = 1; old <= 5; old++) {
                s.executeUpdate("insert into observing_request (version, program_id, owner, target_name, ra_deg, dec_deg,"
                        + " min_altitude_deg, darkness, repeats, priority, state, created_at, updated_at)"
                        + " values (0, (select id from program where code = 'OLD-1'), 'student', 'NGC 2632', 130.1, 19.7,"
                        + " 30, 'ASTRONOMICAL', 2, " + old + ", 'ACCEPTED', current_timestamp, current_timestamp)");
            }
        }
        flyway.target("latest").load().migrate();
        List<Object[]> rows = new ArrayList<>();
        try (Connection c = DriverManager.getConnection(url, user, password); Statement s = c.createStatement();
             ResultSet r = s.executeQuery("select priority, repeat_interval_hours, repeat_tolerance_hours"
                     + " from observing_request order by id")) {
            while (r.next()) {
                rows.add(new Object[] {r.getInt(1), r.getObject(2), r.getObject(3)});
            }
        }
        return rows;
    }

    static void assertFlipped(List<Object[]> rows) {
        // Stored in the order old 1 (highest) .. old 5 (lowest); 6 - p keeps each one's rank.
        assertThat(rows).extracting(r -> r[0]).containsExactly(5, 4, 3, 2, 1);
        // Old requests asked for no spacing; null keeps them planning as before.
        assertThat(rows).allSatisfy(r -> {
            assertThat(r[1]).isNull();
            assertThat(r[2]).isNull();
        });
    }

    @Test
    void onTheEmbeddedDatabaseOldPrioritiesAreFlipped() throws SQLException {
        String url = "jdbc:h2:mem:request-migration;DB_CLOSE_DELAY=-1";
        List<Object[]> rows = migrateOldRows(Flyway.configure().dataSource(url, "sa", ""), url, "sa", "");
        assertFlipped(rows);
    }

    @Nested
    @EnabledIfPostgresReachable
    class OnPostgres {
        @Test
        void oldPrioritiesAreFlipped() throws SQLException {
            String schema = LocalPostgres.newSchemaName();
            String url = LocalPostgres.URL + (LocalPostgres.URL.contains("?") ? "&" : "?") + "currentSchema=" + schema;
            try {
                List<Object[]> rows = migrateOldRows(Flyway.configure()
                        .dataSource(url, LocalPostgres.USER, LocalPostgres.PASSWORD).schemas(schema).defaultSchema(schema),
                        url, LocalPostgres.USER, LocalPostgres.PASSWORD);
                assertFlipped(rows);
            } finally {
                LocalPostgres.dropSchema(schema);
            }
        }
    }
}
