package org.skyrota.web.system;

import java.io.IOException;
import java.sql.SQLException;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CopyOnWriteArrayList;

import com.zaxxer.hikari.SQLExceptionOverride;

/**
 * Failures of the storage under the database: a full disk, and the embedded H2 database closing itself after a
 * write to its file failed. H2 then refuses every statement on its open connections; they are evicted from the pool
 * (this class is the pool's exception override), so that the next connection opens the file again, with everything
 * committed before the failure. Codes from H2's {@code org.h2.api.ErrorCode}.
 */
public final class StorageFailures implements SQLExceptionOverride {

    /** H2: "The database has been closed". */
    static final int H2_DATABASE_IS_CLOSED = 90098;
    /** H2: "IO Exception" (with and without a file name). */
    static final int H2_IO_EXCEPTION_1 = 90028;
    static final int H2_IO_EXCEPTION_2 = 90031;
    /** H2: "General error", which is how a failed write of its store file reaches JDBC. */
    static final int H2_GENERAL_ERROR = 50000;

    /** What drops every pooled connection at once (set by {@link StorageRecovery}); one dead one means all are. */
    private static final List<Runnable> WHEN_CLOSED = new CopyOnWriteArrayList<>();

    static void whenDatabaseCloses(Runnable dropAllConnections) {
        WHEN_CLOSED.add(dropAllConnections);
    }

    static void forget(Runnable dropAllConnections) {
        WHEN_CLOSED.remove(dropAllConnections);
    }

    @java.lang.Override
    public SQLExceptionOverride.Override adjudicate(SQLException e) {
        int code = e.getErrorCode();
        boolean storeFailed = code == H2_GENERAL_ERROR && String.valueOf(e.getMessage()).contains("MVStoreException");
        if (code == H2_DATABASE_IS_CLOSED || code == H2_IO_EXCEPTION_1 || code == H2_IO_EXCEPTION_2 || storeFailed) {
            WHEN_CLOSED.forEach(Runnable::run);
            return SQLExceptionOverride.Override.MUST_EVICT;
        }
        return SQLExceptionOverride.Override.CONTINUE_EVICT;
    }

    /** Whether {@code e} or one of its causes says the disk (or the user's quota) is full. */
    public static boolean diskFull(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
            String message = String.valueOf(t.getMessage()).toLowerCase(Locale.ROOT);
            if ((t instanceof IOException || t instanceof SQLException || t.getClass().getName().startsWith("org.h2."))
                    && (message.contains("no space left on device") || message.contains("disk quota exceeded")
                    || message.contains("not enough space on the disk"))) {
                return true;
            }
        }
        return false;
    }

    /**
     * Whether {@code e} or one of its causes is H2 saying the database has been closed, or the pool saying the
     * connection it handed out was closed under the call (dropped after such a failure).
     */
    public static boolean databaseClosed(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
            if (t instanceof SQLException s && (s.getErrorCode() == H2_DATABASE_IS_CLOSED
                    || "Connection is closed".equals(s.getMessage()))) {
                return true;
            }
        }
        return false;
    }
}
