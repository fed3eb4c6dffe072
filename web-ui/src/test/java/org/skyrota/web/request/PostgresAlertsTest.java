package org.skyrota.web.request;

import java.sql.SQLException;

import javax.sql.DataSource;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Test;
import org.skyrota.web.support.EnabledIfPostgresReachable;
import org.skyrota.web.support.LocalPostgres;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/** The alert tests on PostgreSQL, in a schema of their own: there the unique IVORN index settles the race. */
@EnabledIfPostgresReachable
class PostgresAlertsTest extends AlertsTest {

    private static final String SCHEMA = LocalPostgres.newSchemaName();

    @DynamicPropertySource
    static void postgres(DynamicPropertyRegistry registry) {
        LocalPostgres.register(registry, SCHEMA);
    }

    @AfterAll
    static void dropSchema() throws SQLException {
        LocalPostgres.dropSchema(SCHEMA);
    }

    @Autowired
    DataSource dataSource;

    /** The inherited tests really talk to PostgreSQL in its own schema, not to a fallback database. */
    @Test
    void runsOnPostgresqlInItsOwnSchema() throws SQLException {
        LocalPostgres.assertRunsIn(dataSource, SCHEMA);
    }
}
