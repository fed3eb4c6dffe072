package org.skyrota.plugins.conditions;

import java.util.List;
import org.skyrota.plugin.ImportProblem;
import org.skyrota.plugin.PluginException;

/** A conditions file with bad lines: every one of them, by line number and column. */
public final class ConditionsFileException extends PluginException {

    private final List<ImportProblem> problems;

    ConditionsFileException(String file, List<ImportProblem> problems) {
        super("line " + problems.get(0).line(), summary(file, problems));
        this.problems = List.copyOf(problems);
    }

    /** Every bad line, in file order. */
    public List<ImportProblem> problems() {
        return problems;
    }

    private static String summary(String file, List<ImportProblem> problems) {
        StringBuilder s = new StringBuilder("the conditions file " + file + " has " + problems.size()
                + (problems.size() == 1 ? " problem" : " problems") + ":");
        for (ImportProblem p : problems) {
            s.append("\n  line ").append(p.line());
            if (p.field() != null) {
                s.append(", ").append(p.field());
            }
            s.append(": ").append(p.message());
        }
        return s.toString();
    }
}
