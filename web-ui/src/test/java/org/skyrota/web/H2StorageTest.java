package org.skyrota.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.SQLException;
import javax.sql.DataSource;
import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;

import org.springframework.boot.data.jpa.test.autoconfigure.DataJpaTest;
import org.springframework.context.annotation.Import;
import org.skyrota.web.support.TransactionsConfig;

/** The storage contract on the embedded database (H2, as in a default installation). */
@DataJpaTest
@Import(TransactionsConfig.class)
class H2StorageTest extends StorageContractTest {

    @Autowired
    DataSource dataSource;

    /** The inherited tests really talk to H2, not to a fallback database. */
    @Test
    void runsOnTheEmbeddedH2Database() throws SQLException {
        try (Connection c = dataSource.getConnection()) {
            assertThat(c.getMetaData().getDatabaseProductName()).isEqualTo("H2");
        }
    }
}
