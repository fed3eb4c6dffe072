package org.skyrota.web.report;

/** Who is calling with an API token: the token, its telescope and its scope. Its name in logs and the audit is {@code token:<name>}. */
public record TokenPrincipal(long tokenId, String name, long telescopeId, String scope) {

    @Override
    public String toString() {
        return "token:" + name;
    }
}
