package org.skyrota.web.system;

import java.net.URI;

/**
 * The {@code type} members of Skyrota's own problem documents (RFC 9457). Problems that are
 * nothing more than their HTTP status keep {@code about:blank}.
 */
public final class ProblemTypes {

    public static final URI INVALID_PARAMETERS = URI.create("urn:skyrota:problem:invalid-parameters");
    public static final URI NOT_FOUND = URI.create("urn:skyrota:problem:not-found");
    public static final URI STALE_VERSION = URI.create("urn:skyrota:problem:stale-version");
    public static final URI CONFLICT = URI.create("urn:skyrota:problem:conflict");
    public static final URI FORBIDDEN = URI.create("urn:skyrota:problem:forbidden");
    public static final URI INTERNAL = URI.create("urn:skyrota:problem:internal-error");
    public static final URI STORAGE_FULL = URI.create("urn:skyrota:problem:storage-full");

    private ProblemTypes() {}
}
