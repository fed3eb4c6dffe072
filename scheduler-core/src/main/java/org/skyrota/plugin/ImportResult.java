package org.skyrota.plugin;

import java.util.List;

/**
 * What an importer read: either every request in the file, or the problems that stop the import.
 * A file with any problem imports nothing, so a half-imported file never happens.
 */
public record ImportResult(List<RequestRecord> requests, List<ImportProblem> problems) {

    public ImportResult {
        requests = List.copyOf(requests);
        problems = List.copyOf(problems);
        if (!problems.isEmpty() && !requests.isEmpty()) {
            throw new IllegalArgumentException("an import with problems must carry no requests");
        }
    }

    public static ImportResult of(List<RequestRecord> requests) {
        return new ImportResult(requests, List.of());
    }

    public static ImportResult refused(List<ImportProblem> problems) {
        return new ImportResult(List.of(), problems);
    }

    public boolean isAccepted() {
        return problems.isEmpty();
    }
}
