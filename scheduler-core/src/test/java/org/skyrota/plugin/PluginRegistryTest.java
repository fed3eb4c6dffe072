package org.skyrota.plugin;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Builds small plugin jars at test time, drops them into a temporary plugins folder and checks what
 * the registry loads and what it skips. Nothing here may throw out of a load.
 */
class PluginRegistryTest {

    @TempDir
    Path work;
    Path plugins;

    @BeforeEach
    void folder() throws IOException {
        plugins = Files.createDirectory(work.resolve("plugins"));
    }

    /** A target kind whose right ascension grows by one degree a day from 0 at J2000, at declination +10 degrees. */
    private static String driftSource(String pkg, String cls, String id, String kind, int apiVersion) {
        return """
                package %1$s;
                import java.util.Map;
                import org.skyrota.plugin.*;
                public final class %2$s implements TargetKind {
                    public PluginDescriptor descriptor() { return new PluginDescriptor("%3$s", "Drifting test target", "1.0", %5$d); }
                    public String kind() { return "%4$s"; }
                    public Map<String, String> parameterHelp() { return Map.of("rate", "degrees a day"); }
                    public MovingTarget resolve(Map<String, String> p) throws PluginException {
                        String text = p.get("rate");
                        if (text == null) throw new PluginException("rate", "rate is missing");
                        final double rateRad = Math.toRadians(Double.parseDouble(text));
                        return new MovingTarget() {
                            public String label() { return "drift"; }
                            public void apparentGeocentric(double jdTt, double[] out) {
                                double ra = ((jdTt - 2451545.0) * rateRad) %% (2 * Math.PI);
                                out[0] = ra < 0 ? ra + 2 * Math.PI : ra;
                                out[1] = Math.toRadians(10);
                                out[2] = 1.0e9;
                            }
                        };
                    }
                }
                """.formatted(pkg, cls, id, kind, apiVersion);
    }

    private Path goodJar() throws IOException {
        return new PluginJarBuilder()
                .source("test.good.DriftKind", driftSource("test.good", "DriftKind", "test-drift", "drift", PluginApi.VERSION))
                .service(TargetKind.class, "test.good.DriftKind")
                .writeTo(plugins.resolve("a-good.jar"), work);
    }

    @Test
    void aPluginJarBuiltAtTestTimeLoadsAndRuns() throws Exception {
        goodJar();
        try (PluginJars jars = PluginJars.open(plugins, getClass().getClassLoader())) {
            PluginRegistry registry = PluginRegistry.load(jars.classLoader(), jars.problems(), PluginRegistry.CORE_SERVICES);

            assertThat(registry.problems()).isEmpty();
            assertThat(registry.loaded()).singleElement().satisfies(p -> {
                assertThat(p.service()).isEqualTo("TargetKind");
                assertThat(p.descriptor().id()).isEqualTo("test-drift");
                assertThat(p.provider()).isEqualTo("test.good.DriftKind");
                assertThat(p.source()).endsWith("a-good.jar");
            });
            TargetKind kind = registry.targetKind("drift").orElseThrow();
            // The class came from the jar, not from the test's class path.
            assertThat(kind.getClass().getClassLoader()).isSameAs(jars.classLoader());

            MovingTarget target = kind.resolve(Map.of("rate", "1.0"));
            double[] out = new double[3];
            target.apparentGeocentric(2451545.0 + 90.0, out);
            assertThat(Math.toDegrees(out[0])).isCloseTo(90.0, within(1e-9));
            assertThat(Math.toDegrees(out[1])).isCloseTo(10.0, within(1e-9));
        }
    }

    @Test
    void badJarsAreSkippedAndReportedWhileTheGoodOneStillLoads() throws Exception {
        goodJar();
        // a second provider claiming the id the good one holds
        new PluginJarBuilder()
                .source("test.dup.OtherDrift", driftSource("test.dup", "OtherDrift", "test-drift", "drift-two", PluginApi.VERSION))
                .service(TargetKind.class, "test.dup.OtherDrift")
                .writeTo(plugins.resolve("b-duplicate.jar"), work);
        // random bytes with a .jar name
        byte[] noise = new byte[2048];
        new Random(42).nextBytes(noise);
        Files.write(plugins.resolve("c-corrupt.jar"), noise);
        // a services file naming a class the jar does not hold
        new PluginJarBuilder()
                .service(RequestImporter.class, "test.missing.GoneImporter")
                .writeTo(plugins.resolve("d-missing-class.jar"), work);
        // built for another interface version
        new PluginJarBuilder()
                .source("test.old.OldKind", driftSource("test.old", "OldKind", "test-old", "old", PluginApi.VERSION + 98))
                .service(TargetKind.class, "test.old.OldKind")
                .writeTo(plugins.resolve("e-wrong-api.jar"), work);
        // a provider whose constructor throws
        new PluginJarBuilder()
                .source("test.boom.BoomFeed", """
                        package test.boom;
                        import java.time.LocalDate;
                        import java.util.List;
                        import org.skyrota.plugin.*;
                        public final class BoomFeed implements ConditionsFeed {
                            public BoomFeed() { throw new IllegalStateException("no configuration"); }
                            public PluginDescriptor descriptor() { return new PluginDescriptor("boom", "Boom", "1", PluginApi.VERSION); }
                            public List<SiteCondition> conditions(LocalDate from, LocalDate to) { return List.of(); }
                        }
                        """)
                .service(ConditionsFeed.class, "test.boom.BoomFeed")
                .writeTo(plugins.resolve("f-throws.jar"), work);

        // a class that exists but does not implement the interface it is listed under
        new PluginJarBuilder()
                .source("test.wrong.NotAnExporter", "package test.wrong; public final class NotAnExporter { }")
                .service(PlanExporter.class, "test.wrong.NotAnExporter")
                .writeTo(plugins.resolve("g-not-a-subtype.jar"), work);
        // a services file whose line is not a class name at all
        new PluginJarBuilder()
                .service(PlanExporter.class, "this is not a class name")
                .writeTo(plugins.resolve("h-bad-services-file.jar"), work);

        try (PluginJars jars = PluginJars.open(plugins, getClass().getClassLoader())) {
            PluginRegistry registry = PluginRegistry.load(jars.classLoader(), jars.problems(), PluginRegistry.CORE_SERVICES);

            assertThat(registry.loaded()).extracting(LoadedPlugin::provider).containsExactly("test.good.DriftKind");
            assertThat(registry.targetKind("drift")).isPresent();
            assertThat(registry.targetKind("drift-two")).isEmpty();
            assertThat(registry.targetKind("old")).isEmpty();
            assertThat(registry.conditionsFeeds()).isEmpty();
            assertThat(registry.requestImporters()).isEmpty();

            List<PluginLoadReport> problems = registry.problems();
            assertThat(problems).hasSize(7);
            assertThat(problems).filteredOn(p -> p.source().endsWith("g-not-a-subtype.jar")).singleElement()
                    .satisfies(p -> {
                        assertThat(p.provider()).isEqualTo("test.wrong.NotAnExporter");
                        assertThat(p.problem()).contains("not a subtype");
                    });
            assertThat(problems).filteredOn(p -> p.source().endsWith("h-bad-services-file.jar")).singleElement()
                    .satisfies(p -> assertThat(p.problem()).contains("syntax"));
            assertThat(problems).filteredOn(p -> p.source().endsWith("c-corrupt.jar")).singleElement()
                    .satisfies(p -> assertThat(p.problem()).startsWith("not a readable jar"));
            assertThat(jars.jars()).noneMatch(j -> j.endsWith("c-corrupt.jar"));
            assertThat(problems).filteredOn(p -> p.source().endsWith("d-missing-class.jar")).singleElement()
                    .satisfies(p -> {
                        assertThat(p.provider()).isEqualTo("test.missing.GoneImporter");
                        assertThat(p.problem()).contains("not found");
                    });
            assertThat(problems).filteredOn(p -> p.source().endsWith("e-wrong-api.jar")).singleElement()
                    .satisfies(p -> {
                        assertThat(p.pluginId()).isEqualTo("test-old");
                        assertThat(p.problem()).contains("version " + (PluginApi.VERSION + 98)).contains("version " + PluginApi.VERSION);
                    });
            assertThat(problems).filteredOn(p -> p.source().endsWith("b-duplicate.jar")).singleElement()
                    .satisfies(p -> {
                        assertThat(p.pluginId()).isEqualTo("test-drift");
                        // loud: both providers and both jars are named
                        assertThat(p.problem()).contains("duplicate").contains("test.good.DriftKind").contains("a-good.jar")
                                .contains("test.dup.OtherDrift").contains("b-duplicate.jar");
                    });
            assertThat(problems).filteredOn(p -> p.source().endsWith("f-throws.jar")).singleElement()
                    .satisfies(p -> {
                        assertThat(p.provider()).isEqualTo("test.boom.BoomFeed");
                        assertThat(p.problem()).contains("no configuration");
                    });
        }
    }

    @Test
    void aMissingFolderHoldsNoPluginsAndIsNotAnError() throws IOException {
        try (PluginJars jars = PluginJars.open(work.resolve("does-not-exist"), getClass().getClassLoader())) {
            PluginRegistry registry = PluginRegistry.load(jars.classLoader(), jars.problems(), PluginRegistry.CORE_SERVICES);
            assertThat(registry.loaded()).isEmpty();
            assertThat(registry.problems()).isEmpty();
        }
    }

    private record Exporter(String id, String mediaType, int apiVersion) implements PlanExporter {
        public PluginDescriptor descriptor() {
            return new PluginDescriptor(id, "Exporter " + id, "1", apiVersion);
        }

        public String fileExtension() {
            return "txt";
        }

        public void write(PlanRecord plan, java.io.OutputStream out) throws IOException {
            out.write(plan.title().getBytes(java.nio.charset.StandardCharsets.UTF_8));
        }
    }

    @Test
    void injectedInstancesGetTheSameChecks() {
        PluginRegistry registry = PluginRegistry.of(List.of(
                new Exporter("text", "text/plain", PluginApi.VERSION),
                new Exporter("text", "text/other", PluginApi.VERSION),
                new Exporter("future", "text/future", PluginApi.VERSION + 1)));

        assertThat(registry.planExporters()).extracting(PlanExporter::mediaType).containsExactly("text/plain");
        assertThat(registry.planExporter("TEXT/PLAIN")).isPresent();
        assertThat(registry.problems()).extracting(PluginLoadReport::pluginId).containsExactly("text", "future");
        // Each registry is its own value: a fresh one starts empty.
        assertThat(PluginRegistry.of(List.of()).planExporters()).isEmpty();
    }

    private record Kind(String id, String kind) implements TargetKind {
        public PluginDescriptor descriptor() {
            return new PluginDescriptor(id, "Kind " + id, "1", PluginApi.VERSION);
        }

        public Map<String, String> parameterHelp() {
            return Map.of();
        }

        public MovingTarget resolve(Map<String, String> parameters) {
            throw new UnsupportedOperationException();
        }
    }

    @Test
    void aTargetKindNameIsUniqueAndFixedIsReserved() {
        PluginRegistry registry = PluginRegistry.of(List.of(
                new Kind("one", "planet"), new Kind("two", "planet"), new Kind("three", "fixed"), new Kind("four", "Bad Name")));

        assertThat(registry.targetKinds()).extracting(TargetKind::descriptor).extracting(PluginDescriptor::id).containsExactly("one");
        assertThat(registry.problems()).extracting(PluginLoadReport::problem)
                .satisfiesExactly(
                        p -> assertThat(p).contains("duplicate target kind planet"),
                        p -> assertThat(p).contains("built in"),
                        p -> assertThat(p).contains("lower case"));
    }
}
