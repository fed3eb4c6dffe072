package org.skyrota.web;

import javax.sql.DataSource;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;

import java.sql.SQLException;

import org.junit.jupiter.api.AfterAll;
import org.skyrota.web.support.EnabledIfPostgresReachable;
import org.skyrota.web.support.LocalPostgres;
import org.springframework.boot.data.jpa.test.autoconfigure.DataJpaTest;
import org.springframework.boot.jdbc.test.autoconfigure.AutoConfigureTestDatabase;
import org.springframework.context.annotation.Import;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;
import org.skyrota.web.support.TransactionsConfig;

/** The storage contract on PostgreSQL, in a schema of its own that is dropped afterwards. */
@EnabledIfPostgresReachable
@DataJpaTest
@AutoConfigureTestDatabase(replace = AutoConfigureTestDatabase.Replace.NONE)
@Import(TransactionsConfig.class)
class PostgresStorageTest extends StorageContractTest {

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
