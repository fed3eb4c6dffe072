package org.skyrota.web.system;

import java.sql.SQLException;

import org.springframework.boot.diagnostics.AbstractFailureAnalyzer;
import org.springframework.boot.diagnostics.FailureAnalysis;
import org.springframework.core.env.Environment;

/**
 * A start that fails because the database cannot be reached or refuses the account (SQL states 08 and 28) is
 * reported in one plain sentence naming the URL, with what to check, instead of a stack trace. Spring Boot prints
 * the analysis and the process exits with a non-zero code.
 */
class DatabaseUnreachableAnalyzer extends AbstractFailureAnalyzer<SQLException> {

    private final Environment environment;

    DatabaseUnreachableAnalyzer(Environment environment) {
        this.environment = environment;
    }

    @Override
    protected FailureAnalysis analyze(Throwable rootFailure, SQLException cause) {
        SQLException connection = connectionFailure(rootFailure);
        if (connection == null) {
            return null;
        }
        String url = environment.getProperty("spring.datasource.url", "(no spring.datasource.url)");
        boolean refusedLogin = connection.getSQLState().startsWith("28");
        String description = "Skyrota cannot " + (refusedLogin ? "sign in to" : "reach") + " its database at " + url + ": "
                + firstLine(connection.getMessage());
        String action = refusedLogin
                ? "Check SKYROTA_DB_USER and SKYROTA_DB_PASSWORD (the postgres profile reads them from the environment)."
                : "Check that the database server is running and reachable from here, and SKYROTA_DB_URL "
                + "(the postgres profile reads it from the environment).";
        return new FailureAnalysis(description, action, null);
    }

    /** The first SQL exception in the chain whose state says the connection or its login failed. */
    private static SQLException connectionFailure(Throwable failure) {
        for (Throwable t = failure; t != null; t = t.getCause() == t ? null : t.getCause()) {
            if (t instanceof SQLException sql && sql.getSQLState() != null
                    && (sql.getSQLState().startsWith("08") || sql.getSQLState().startsWith("28"))) {
                return sql;
            }
        }
        return null;
    }

    private static String firstLine(String text) {
        if (text == null) {
            return "(no message)";
        }
        int nl = text.indexOf('\n');
        return (nl < 0 ? text : text.substring(0, nl)).trim();
    }
}
