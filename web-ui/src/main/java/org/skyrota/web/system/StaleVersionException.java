package org.skyrota.web.system;

/** An edit was made against an older version than the stored one; answered as HTTP 409 with the current version. */
public class StaleVersionException extends RuntimeException {

    private final long currentVersion;

    public StaleVersionException(String kind, Object id, long givenVersion, long currentVersion) {
        super("The " + kind + " " + id + " is at version " + currentVersion + ", the edit was made against version "
                + givenVersion + "; read it again and repeat the edit");
        this.currentVersion = currentVersion;
    }

    public long currentVersion() {
        return currentVersion;
    }
}
