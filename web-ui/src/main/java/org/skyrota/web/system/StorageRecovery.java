package org.skyrota.web.system;

import javax.sql.DataSource;

import com.zaxxer.hikari.HikariDataSource;

import jakarta.annotation.PreDestroy;

import org.springframework.stereotype.Component;

/**
 * Lets {@link StorageFailures} drop every connection of this server's pool when the embedded database closes itself
 * after a failed write, so that the very next call opens the file again instead of each pooled connection failing
 * once in turn.
 */
@Component
class StorageRecovery {

    private final Runnable dropAll;

    StorageRecovery(DataSource dataSource) {
        HikariDataSource pool = dataSource instanceof HikariDataSource h ? h : null;
        this.dropAll = () -> {
            if (pool != null && pool.getHikariPoolMXBean() != null) {
                pool.getHikariPoolMXBean().softEvictConnections();
            }
        };
        StorageFailures.whenDatabaseCloses(dropAll);
    }

    @PreDestroy
    void stop() {
        StorageFailures.forget(dropAll);
    }
}
