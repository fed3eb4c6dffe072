package org.skyrota.web.plugin;

import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

import org.skyrota.plugin.MovingTarget;
import org.skyrota.plugin.PluginException;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.TargetKind;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.springframework.stereotype.Component;

/**
 * The server's target kinds: {@code fixed} (an ICRS position, built in) and those of the loaded plugins. Resolving a
 * kind's parameters is both the check of a request's target and the way to its position; a bad kind or parameter is
 * a 400 naming {@code targetKind} or {@code targetParameters.<name>}.
 */
@Component
public class TargetKinds {

    public static final String FIXED = PluginRegistry.FIXED_KIND;
    public static final String KIND_FIELD = "targetKind";
    public static final String PARAMETERS_FIELD = "targetParameters";

    private final PluginRegistry registry;

    public TargetKinds(PluginRegistry registry) {
        this.registry = registry;
    }

    /** The kind as stored: trimmed, lower case, {@code fixed} when absent. */
    public static String normalise(String kind) {
        return kind == null || kind.isBlank() ? FIXED : kind.strip().toLowerCase(Locale.ROOT);
    }

    public static boolean isFixed(String kind) {
        return FIXED.equals(normalise(kind));
    }

    /** The kinds plugins provide, in load order. */
    public List<TargetKind> kinds() {
        return registry.targetKinds();
    }

    /**
     * The position a request of this kind describes.
     *
     * @throws InvalidParametersException for {@code fixed}, an unknown kind, or parameters the kind refuses
     */
    public MovingTarget resolve(String kind, Map<String, String> parameters) {
        String name = normalise(kind);
        Optional<TargetKind> found = isFixed(name) ? Optional.empty() : registry.targetKind(name);
        if (found.isEmpty()) {
            List<String> known = new java.util.ArrayList<>(List.of(FIXED));
            kinds().forEach(k -> known.add(k.kind()));
            throw new InvalidParametersException(List.of(new FieldProblem(KIND_FIELD,
                    isFixed(name) ? "a fixed target has no position to resolve" : "unknown target kind \"" + kind
                            + "\"; this server knows " + String.join(", ", known))));
        }
        try {
            return found.get().resolve(parameters == null ? Map.of() : Map.copyOf(parameters));
        } catch (PluginException e) {
            String field = e.field() == null || e.field().isBlank() ? PARAMETERS_FIELD : PARAMETERS_FIELD + "." + e.field();
            throw new InvalidParametersException(List.of(new FieldProblem(field, e.getMessage())));
        } catch (RuntimeException e) {
            // A plugin that fails in its own code must not take the request down with a 500.
            throw new InvalidParametersException(List.of(new FieldProblem(PARAMETERS_FIELD,
                    "the " + name + " plugin could not resolve these parameters: " + e.getMessage())));
        }
    }
}
