package org.skyrota.web.term;

import java.sql.SQLException;

import javax.sql.DataSource;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Test;
import org.skyrota.web.support.EnabledIfPostgresReachable;
import org.skyrota.web.support.LocalPostgres;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/** {@link TermOperationsTest} on PostgreSQL, in a schema of its own. */
@EnabledIfPostgresReachable
class PostgresTermOperationsTest extends TermOperationsTest {

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

    @Test
    void runsOnPostgresqlInItsOwnSchema() throws SQLException {
        LocalPostgres.assertRunsIn(dataSource, SCHEMA);
    }
}
