package org.skyrota.web.system;

import java.util.List;

/** One or more request parameters failed their checks; answered as HTTP 400 naming every one. */
public class InvalidParametersException extends RuntimeException {

    private final List<FieldProblem> problems;

    public InvalidParametersException(List<FieldProblem> problems) {
        super(describe(problems));
        if (problems.isEmpty()) {
            throw new IllegalArgumentException("at least one problem is needed");
        }
        this.problems = List.copyOf(problems);
    }

    public List<FieldProblem> problems() {
        return problems;
    }

    private static String describe(List<FieldProblem> problems) {
        StringBuilder text = new StringBuilder();
        for (FieldProblem p : problems) {
            if (text.length() > 0) {
                text.append("; ");
            }
            text.append(p.field()).append(": ").append(p.message());
        }
        return text.toString();
    }
}
