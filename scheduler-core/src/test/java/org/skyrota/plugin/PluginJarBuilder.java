package org.skyrota.plugin;

import java.io.IOException;
import java.io.OutputStream;
import java.io.StringWriter;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.jar.Attributes;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.jar.Manifest;
import java.util.stream.Stream;
import javax.tools.JavaCompiler;
import javax.tools.ToolProvider;

/** Compiles a few Java sources against scheduler-core and jars them with their services files, at test time. */
final class PluginJarBuilder {

    private final Map<String, String> sources = new LinkedHashMap<>();
    private final Map<String, List<String>> services = new LinkedHashMap<>();

    /** Adds a source file; {@code className} is the fully qualified class name. */
    PluginJarBuilder source(String className, String code) {
        sources.put(className, code);
        return this;
    }

    /** Lists a provider class under {@code META-INF/services/<service>}. */
    PluginJarBuilder service(Class<?> service, String providerClass) {
        services.computeIfAbsent(service.getName(), s -> new ArrayList<>()).add(providerClass);
        return this;
    }

    Path writeTo(Path jar, Path work) throws IOException {
        Path src = Files.createTempDirectory(work, "src");
        Path classes = Files.createTempDirectory(work, "classes");
        List<String> files = new ArrayList<>();
        for (Map.Entry<String, String> s : sources.entrySet()) {
            Path file = src.resolve(s.getKey().replace('.', '/') + ".java");
            Files.createDirectories(file.getParent());
            Files.writeString(file, s.getValue());
            files.add(file.toString());
        }
        if (!files.isEmpty()) {
            compile(files, classes);
        }
        Manifest manifest = new Manifest();
        manifest.getMainAttributes().put(Attributes.Name.MANIFEST_VERSION, "1.0");
        try (OutputStream out = Files.newOutputStream(jar); JarOutputStream jarOut = new JarOutputStream(out, manifest)) {
            try (Stream<Path> walk = Files.walk(classes)) {
                for (Path f : (Iterable<Path>) walk.filter(Files::isRegularFile)::iterator) {
                    jarOut.putNextEntry(new JarEntry(classes.relativize(f).toString().replace('\\', '/')));
                    jarOut.write(Files.readAllBytes(f));
                    jarOut.closeEntry();
                }
            }
            for (Map.Entry<String, List<String>> s : services.entrySet()) {
                jarOut.putNextEntry(new JarEntry("META-INF/services/" + s.getKey()));
                jarOut.write((String.join("\n", s.getValue()) + "\n").getBytes(StandardCharsets.UTF_8));
                jarOut.closeEntry();
            }
        }
        return jar;
    }

    private static void compile(List<String> files, Path classes) throws IOException {
        JavaCompiler compiler = ToolProvider.getSystemJavaCompiler();
        if (compiler == null) {
            throw new IllegalStateException("tests need a JDK, not a JRE: no system Java compiler");
        }
        List<String> args = new ArrayList<>(List.of("--release", "17", "-classpath", coreClasses(), "-d", classes.toString()));
        args.addAll(files);
        StringWriter errors = new StringWriter();
        int rc = compiler.run(null, null, new java.io.PrintStream(new java.io.OutputStream() {
            @Override
            public void write(int b) {
                errors.write(b);
            }
        }), args.toArray(String[]::new));
        if (rc != 0) {
            throw new IllegalStateException("test plugin did not compile:\n" + errors);
        }
    }

    /** Where the plugin interfaces were compiled to (target/classes or the scheduler-core jar). */
    private static String coreClasses() {
        try {
            return Path.of(PluginApi.class.getProtectionDomain().getCodeSource().getLocation().toURI()).toString();
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }
}
