package org.skyrota.plugin;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.CodeSource;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Collections;
import java.util.Enumeration;
import java.util.HashMap;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.ServiceConfigurationError;
import java.util.ServiceLoader;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The plugins found through {@link ServiceLoader}, and the ones that were skipped with the reason.
 *
 * <p>Loading never throws because of a plugin: a provider whose class is missing or whose
 * constructor throws, a jar that cannot be read (see {@link PluginJars}), a plugin built for
 * another {@link PluginApi#VERSION}, and a second provider claiming an id that an earlier provider
 * of the same interface already holds are each left out and described in {@link #problems()}.
 * A duplicate is refused loudly, naming both providers, and the first one found keeps the id
 * (providers on the class path come before those in the plugins folder, whose jars are taken in
 * file-name order).
 *
 * <p>A registry is an immutable value, not global state: the server builds one at start and
 * replaces it to reload; tests build their own with {@link #load(ClassLoader)} or inject plugin
 * instances with {@link #of(Collection)}.
 */
public final class PluginRegistry {

    /** The interfaces loaded by default: those that need no solver types. */
    public static final List<Class<? extends SkyrotaPlugin>> CORE_SERVICES =
            List.of(TargetKind.class, RequestImporter.class, PlanExporter.class, ConditionsFeed.class);

    /** The target kind every Skyrota knows without a plugin; no plugin may claim it. */
    public static final String FIXED_KIND = "fixed";

    private static final Pattern KIND = Pattern.compile("[a-z][a-z0-9\\-]{0,31}");
    private static final Pattern SERVICES_FILE_IN_MESSAGE = Pattern.compile("((?:jar:)?file:[^\\s]*META-INF/services/[^\\s:]+)");
    private static final Pattern PROVIDER_IN_MESSAGE = Pattern.compile("Provider (\\S+)|(\\S+) not a subtype");
    /** Guards against a ServiceLoader iterator that fails without advancing. */
    private static final int MAX_ERRORS_PER_SERVICE = 1000;

    private final Map<Class<? extends SkyrotaPlugin>, List<SkyrotaPlugin>> byService;
    private final List<LoadedPlugin> loaded;
    private final List<PluginLoadReport> problems;

    private PluginRegistry(Map<Class<? extends SkyrotaPlugin>, List<SkyrotaPlugin>> byService,
            List<LoadedPlugin> loaded, List<PluginLoadReport> problems) {
        Map<Class<? extends SkyrotaPlugin>, List<SkyrotaPlugin>> copy = new LinkedHashMap<>();
        byService.forEach((k, v) -> copy.put(k, List.copyOf(v)));
        this.byService = Collections.unmodifiableMap(copy);
        this.loaded = List.copyOf(loaded);
        this.problems = List.copyOf(problems);
    }

    /** Loads the four core plugin interfaces from a class loader. */
    public static PluginRegistry load(ClassLoader loader) {
        return load(loader, List.of(), CORE_SERVICES);
    }

    /**
     * Loads plugins from a class loader.
     *
     * @param loader   where to look, for example {@link PluginJars#classLoader()}; not null
     * @param earlier  problems already found (the jars {@link PluginJars} left out), kept at the head of {@link #problems()}
     * @param services the plugin interfaces to load, for example {@link #CORE_SERVICES} plus the score-rule interface
     */
    public static PluginRegistry load(ClassLoader loader, List<PluginLoadReport> earlier,
            Collection<Class<? extends SkyrotaPlugin>> services) {
        Builder builder = new Builder(earlier);
        for (Class<? extends SkyrotaPlugin> service : new LinkedHashSet<>(services)) {
            builder.loadService(service, loader);
        }
        return builder.build();
    }

    /**
     * A registry of plugin instances given directly, with the same checks as loading (interface
     * version, duplicate ids). Each instance is registered under every core interface it implements.
     */
    public static PluginRegistry of(Collection<? extends SkyrotaPlugin> plugins) {
        return of(plugins, CORE_SERVICES);
    }

    /** As {@link #of(Collection)}, for the given plugin interfaces (for example with the score-rule interface). */
    public static PluginRegistry of(Collection<? extends SkyrotaPlugin> plugins,
            Collection<Class<? extends SkyrotaPlugin>> services) {
        Builder builder = new Builder(List.of());
        for (Class<? extends SkyrotaPlugin> service : new LinkedHashSet<>(services)) {
            for (SkyrotaPlugin plugin : plugins) {
                if (service.isInstance(plugin)) {
                    builder.accept(service, plugin, "given");
                }
            }
        }
        return builder.build();
    }

    /** Every loaded provider of an interface, in load order. */
    public <T extends SkyrotaPlugin> List<T> plugins(Class<T> service) {
        List<SkyrotaPlugin> found = byService.getOrDefault(service, List.of());
        List<T> typed = new ArrayList<>(found.size());
        for (SkyrotaPlugin p : found) {
            typed.add(service.cast(p));
        }
        return Collections.unmodifiableList(typed);
    }

    public List<TargetKind> targetKinds() {
        return plugins(TargetKind.class);
    }

    public List<RequestImporter> requestImporters() {
        return plugins(RequestImporter.class);
    }

    public List<PlanExporter> planExporters() {
        return plugins(PlanExporter.class);
    }

    public List<ConditionsFeed> conditionsFeeds() {
        return plugins(ConditionsFeed.class);
    }

    /** The target kind of that name ({@link TargetKind#kind()}), if a plugin provides it. */
    public Optional<TargetKind> targetKind(String kind) {
        return targetKinds().stream().filter(k -> k.kind().equals(kind)).findFirst();
    }

    /** The first importer of that media type, in load order. */
    public Optional<RequestImporter> requestImporter(String mediaType) {
        return requestImporters().stream().filter(i -> i.mediaType().equalsIgnoreCase(mediaType)).findFirst();
    }

    /** The first exporter of that media type, in load order. */
    public Optional<PlanExporter> planExporter(String mediaType) {
        return planExporters().stream().filter(e -> e.mediaType().equalsIgnoreCase(mediaType)).findFirst();
    }

    /** Every provider that loaded, in load order. */
    public List<LoadedPlugin> loaded() {
        return loaded;
    }

    /** Every jar or provider that was skipped, and why. */
    public List<PluginLoadReport> problems() {
        return problems;
    }

    private static final class Builder {
        private final Map<Class<? extends SkyrotaPlugin>, List<SkyrotaPlugin>> byService = new LinkedHashMap<>();
        private final List<LoadedPlugin> loaded = new ArrayList<>();
        private final List<PluginLoadReport> problems;
        /** (service, id) and (TargetKind, kind) to the provider that holds it, for duplicate reports. */
        private final Map<String, LoadedPlugin> claimed = new HashMap<>();

        Builder(List<PluginLoadReport> earlier) {
            this.problems = new ArrayList<>(earlier);
        }

        void loadService(Class<? extends SkyrotaPlugin> service, ClassLoader loader) {
            Map<String, String> sources = serviceFileSources(service, loader);
            Iterator<? extends SkyrotaPlugin> it;
            try {
                it = ServiceLoader.load(service, loader).iterator();
            } catch (ServiceConfigurationError e) {
                problems.add(new PluginLoadReport("class path", null, null, describe(e)));
                return;
            }
            int errors = 0;
            while (errors < MAX_ERRORS_PER_SERVICE) {
                SkyrotaPlugin plugin;
                try {
                    if (!it.hasNext()) {
                        break;
                    }
                    plugin = it.next();
                } catch (ServiceConfigurationError | LinkageError e) {
                    errors++;
                    String provider = providerIn(e);
                    String source = provider != null ? sources.getOrDefault(provider, "class path") : servicesFileIn(e);
                    problems.add(new PluginLoadReport(source, provider, null, describe(e)));
                    continue;
                }
                accept(service, plugin, sourceOf(plugin.getClass(), sources));
            }
        }

        void accept(Class<? extends SkyrotaPlugin> service, SkyrotaPlugin plugin, String source) {
            String provider = plugin.getClass().getName();
            PluginDescriptor descriptor;
            try {
                descriptor = plugin.descriptor();
            } catch (RuntimeException | LinkageError e) {
                problems.add(new PluginLoadReport(source, provider, null, "descriptor() failed: " + describe(e)));
                return;
            }
            if (descriptor == null) {
                problems.add(new PluginLoadReport(source, provider, null, "descriptor() returned null"));
                return;
            }
            String id = descriptor.id();
            if (!descriptor.isCompatible()) {
                problems.add(new PluginLoadReport(source, provider, id, "built for plugin interface version "
                        + descriptor.apiVersion() + " but this Skyrota has version " + PluginApi.VERSION));
                return;
            }
            LoadedPlugin entry = new LoadedPlugin(service.getSimpleName(), descriptor, provider, source);
            List<String> keys = new ArrayList<>();
            keys.add(service.getName() + " id " + id);
            if (plugin instanceof TargetKind kind && service == TargetKind.class) {
                String name;
                try {
                    name = kind.kind();
                } catch (RuntimeException | LinkageError e) {
                    problems.add(new PluginLoadReport(source, provider, id, "kind() failed: " + describe(e)));
                    return;
                }
                if (name == null || !KIND.matcher(name).matches()) {
                    problems.add(new PluginLoadReport(source, provider, id,
                            "target kind name must be lower case letters, digits or dashes (1-32 chars): " + name));
                    return;
                }
                if (name.equals(FIXED_KIND)) {
                    problems.add(new PluginLoadReport(source, provider, id,
                            "target kind \"fixed\" is built in and cannot be provided by a plugin"));
                    return;
                }
                keys.add("target kind " + name);
            }
            for (String key : keys) {
                LoadedPlugin holder = claimed.get(key);
                if (holder != null) {
                    problems.add(new PluginLoadReport(source, provider, id, "duplicate " + key.replace(service.getName(),
                            service.getSimpleName()) + ": provided by both " + holder.provider() + " (" + holder.source()
                            + ") and " + provider + " (" + source + "); the second is skipped"));
                    return;
                }
            }
            for (String key : keys) {
                claimed.put(key, entry);
            }
            byService.computeIfAbsent(service, s -> new ArrayList<>()).add(plugin);
            loaded.add(entry);
        }

        PluginRegistry build() {
            return new PluginRegistry(byService, loaded, problems);
        }
    }

    /** Where each provider class named in a services file of the loader comes from. */
    private static Map<String, String> serviceFileSources(Class<?> service, ClassLoader loader) {
        Map<String, String> sources = new HashMap<>();
        try {
            Enumeration<URL> files = loader.getResources("META-INF/services/" + service.getName());
            while (files.hasMoreElements()) {
                URL file = files.nextElement();
                String source = sourceOf(file);
                try (InputStream in = file.openStream();
                        BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
                    String line;
                    while ((line = reader.readLine()) != null) {
                        int hash = line.indexOf('#');
                        String name = (hash >= 0 ? line.substring(0, hash) : line).trim();
                        if (!name.isEmpty()) {
                            sources.putIfAbsent(name, source);
                        }
                    }
                } catch (IOException e) {
                    // ServiceLoader meets the same file and reports it; the source is only a label here
                }
            }
        } catch (IOException e) {
            // as above
        }
        return sources;
    }

    private static String sourceOf(Class<?> type, Map<String, String> sources) {
        String known = sources.get(type.getName());
        if (known != null) {
            return known;
        }
        try {
            CodeSource code = type.getProtectionDomain().getCodeSource();
            if (code != null && code.getLocation() != null) {
                return Path.of(code.getLocation().toURI()).toString();
            }
        } catch (URISyntaxException | RuntimeException e) {
            // fall through to the generic label
        }
        return "class path";
    }

    /** The jar or folder a services file lies in. */
    private static String sourceOf(URL servicesFile) {
        String text = servicesFile.toString();
        String suffix = "META-INF/services/";
        try {
            if (text.startsWith("jar:")) {
                int bang = text.indexOf("!/");
                return Path.of(new URL(text.substring(4, bang)).toURI()).toString();
            }
            if (text.startsWith("file:")) {
                int at = text.lastIndexOf(suffix);
                return Path.of(new URL(text.substring(0, at)).toURI()).toString();
            }
        } catch (IOException | URISyntaxException | RuntimeException e) {
            // fall through
        }
        return text;
    }

    /** A malformed services file is named in the message by its URL; the jar is the source. */
    private static String servicesFileIn(Throwable e) {
        if (e.getMessage() != null) {
            Matcher m = SERVICES_FILE_IN_MESSAGE.matcher(e.getMessage());
            if (m.find()) {
                try {
                    return sourceOf(new URL(m.group(1)));
                } catch (IOException ignored) {
                    // fall through
                }
            }
        }
        return "class path";
    }

    private static String providerIn(Throwable e) {
        if (e.getMessage() == null) {
            return null;
        }
        Matcher m = PROVIDER_IN_MESSAGE.matcher(e.getMessage());
        if (!m.find()) {
            return null;
        }
        return m.group(1) != null ? m.group(1) : m.group(2);
    }

    private static String describe(Throwable e) {
        StringBuilder text = new StringBuilder(e.getClass().getSimpleName() + ": " + e.getMessage());
        Set<Throwable> seen = new LinkedHashSet<>();
        for (Throwable cause = e.getCause(); cause != null && seen.add(cause); cause = cause.getCause()) {
            text.append("; caused by ").append(cause.getClass().getSimpleName()).append(": ").append(cause.getMessage());
        }
        return text.toString();
    }
}
