package org.skyrota.plugins.solarsystem;

import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Collectors;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.plugin.PluginException;
import org.skyrota.plugin.TargetKind;

/**
 * The target kind {@code planet}: one parameter, {@code body}, one of mercury, venus, mars,
 * jupiter, saturn, uranus, neptune or moon. Planets come from the JPL approximate Keplerian
 * elements (accuracy of arcseconds to about ten arcminutes, see {@link PlanetTarget}); the Moon
 * from the sky engine.
 */
public final class SolarSystemKind implements TargetKind {

    public static final String KIND = "planet";
    public static final String BODY = "body";
    static final PluginDescriptor DESCRIPTOR =
            new PluginDescriptor("solar-system", "Solar-system targets", "1.0", PluginApi.VERSION);

    private static final Map<String, MovingTarget> TARGETS = targets();

    private static Map<String, MovingTarget> targets() {
        Map<String, MovingTarget> m = new java.util.LinkedHashMap<>();
        for (Planet p : Planet.values()) {
            if (p != Planet.EARTH_MOON_BARYCENTRE) {
                m.put(p.name().toLowerCase(Locale.ROOT), new PlanetTarget(p));
            }
        }
        m.put("moon", new MoonTarget());
        return Map.copyOf(m);
    }

    private static final String NAMES = Arrays.stream(Planet.values())
            .filter(p -> p != Planet.EARTH_MOON_BARYCENTRE)
            .map(p -> p.name().toLowerCase(Locale.ROOT))
            .collect(Collectors.joining(", ")) + " or moon";

    @Override
    public PluginDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public String description() {
        return "The planets (JPL approximate Keplerian elements, 1800-2050) and the Moon as targets.";
    }

    @Override
    public String kind() {
        return KIND;
    }

    @Override
    public Map<String, String> parameterHelp() {
        return Map.of(BODY, "the body: " + NAMES);
    }

    @Override
    public MovingTarget resolve(Map<String, String> parameters) throws PluginException {
        String body = parameters.get(BODY);
        if (body == null || body.isBlank()) {
            throw new PluginException(BODY, "body is missing; it must be " + NAMES);
        }
        String key = body.strip().toLowerCase(Locale.ROOT);
        MovingTarget target = TARGETS.get(key);
        if (target == null) {
            String why = key.equals("earth") ? "the Earth is where we observe from; " : key.equals("sun")
                    ? "the Sun is not offered as a target (it needs a certified solar filter); " : "";
            throw new PluginException(BODY, why + "unknown body \"" + body + "\"; it must be " + NAMES);
        }
        for (String name : parameters.keySet()) {
            if (!BODY.equals(name)) {
                throw new PluginException(name, "the planet kind takes only the parameter body, not " + name);
            }
        }
        return target;
    }
}
