package org.skyrota.web.support;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Locale;
import java.util.UUID;

import javax.sql.DataSource;

import org.springframework.test.context.DynamicPropertyRegistry;

/**
 * The PostgreSQL server the tests use: the one on this machine (CI starts it), or the one
 * named by {@code SKYROTA_TEST_DB_URL}/{@code _USER}/{@code _PASSWORD}. Each test class works in
 * a schema of its own, so that parallel builds on one server do not see each other's rows.
 */
public final class LocalPostgres {

    public static final String URL = env("SKYROTA_TEST_DB_URL", "jdbc:postgresql://127.0.0.1:5432/test");
    public static final String USER = env("SKYROTA_TEST_DB_USER", "postgres");
    public static final String PASSWORD = env("SKYROTA_TEST_DB_PASSWORD", "");

    private LocalPostgres() {}

    /** Null when the server answers, else why it does not. */
    static String unreachableReason() {
        DriverManager.setLoginTimeout(3);
        try (Connection c = DriverManager.getConnection(URL, USER, PASSWORD)) {
            return c.isValid(3) ? null : "the connection is not valid";
        } catch (SQLException e) {
            return e.getMessage();
        }
    }

    public static String newSchemaName() {
        return "skyrota_test_" + UUID.randomUUID().toString().replace("-", "").substring(0, 12).toLowerCase(Locale.ROOT);
    }

    /** Points Spring's data source, Flyway and Hibernate at {@code schema}; Flyway creates it. */
    public static void register(DynamicPropertyRegistry registry, String schema) {
        String separator = URL.contains("?") ? "&" : "?";
        registry.add("spring.datasource.url", () -> URL + separator + "currentSchema=" + schema);
        registry.add("spring.datasource.username", () -> USER);
        registry.add("spring.datasource.password", () -> PASSWORD);
        registry.add("spring.flyway.schemas", () -> schema);
        registry.add("spring.flyway.default-schema", () -> schema);
        registry.add("spring.jpa.properties.hibernate.default_schema", () -> schema);
    }

    public static void dropSchema(String schema) throws SQLException {
        try (Connection c = DriverManager.getConnection(URL, USER, PASSWORD); Statement s = c.createStatement()) {
            s.execute("drop schema if exists " + schema + " cascade");
        }
    }

    private static String env(String name, String fallback) {
        String value = System.getenv(name);
        return value == null || value.isBlank() ? fallback : value;
    }

    /** Asserts that {@code dataSource} really is PostgreSQL, in {@code schema}: no test silently falls back to H2. */
    public static void assertRunsIn(DataSource dataSource, String schema) throws SQLException {
        try (Connection c = dataSource.getConnection()) {
            assertThat(c.getMetaData().getDatabaseProductName()).isEqualTo("PostgreSQL");
            assertThat(c.getSchema()).isEqualTo(schema);
        }
    }
}
