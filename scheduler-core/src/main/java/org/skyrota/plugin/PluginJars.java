package org.skyrota.plugin;

import java.io.IOException;
import java.io.InputStream;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Enumeration;
import java.util.List;
import java.util.jar.JarEntry;
import java.util.jar.JarFile;

/**
 * A class loader over the jars of a plugins folder, with the jars that could not be used.
 * Every {@code *.jar} directly in the folder is opened and read through before it is put on the
 * class path, so that a corrupt or unreadable jar is reported here rather than failing later in
 * the middle of a {@link java.util.ServiceLoader} iteration.
 *
 * @param classLoader a loader over the good jars whose parent is the loader given; close it when the plugins are no longer used
 * @param jars        the jars on it, sorted by file name
 * @param problems    the jars left out, and why
 */
public record PluginJars(URLClassLoader classLoader, List<Path> jars, List<PluginLoadReport> problems)
        implements AutoCloseable {

    public PluginJars {
        jars = List.copyOf(jars);
        problems = List.copyOf(problems);
    }

    /**
     * Opens the jars of a folder. A folder that does not exist holds no plugins and is not an error.
     *
     * @param folder the plugins folder; not null
     * @param parent the loader the plugins see Skyrota's classes through, normally the server's own
     * @return the loader and the jars that were left out; never throws for a bad jar
     */
    public static PluginJars open(Path folder, ClassLoader parent) {
        List<Path> good = new ArrayList<>();
        List<PluginLoadReport> problems = new ArrayList<>();
        if (Files.isDirectory(folder)) {
            List<Path> candidates = new ArrayList<>();
            try (DirectoryStream<Path> dir = Files.newDirectoryStream(folder, "*.jar")) {
                dir.forEach(candidates::add);
            } catch (IOException e) {
                problems.add(new PluginLoadReport(folder.toString(), null, null,
                        "the plugins folder cannot be listed: " + e));
            }
            candidates.sort(null);
            for (Path jar : candidates) {
                String unreadable = checkReadable(jar);
                if (unreadable == null) {
                    good.add(jar);
                } else {
                    problems.add(new PluginLoadReport(jar.toString(), null, null, unreadable));
                }
            }
        } else if (Files.exists(folder)) {
            problems.add(new PluginLoadReport(folder.toString(), null, null, "the plugins path is not a folder"));
        }
        List<URL> urls = new ArrayList<>();
        for (Path jar : good) {
            try {
                urls.add(jar.toUri().toURL());
            } catch (MalformedURLException e) {
                problems.add(new PluginLoadReport(jar.toString(), null, null, "the jar's path is not a URL: " + e));
            }
        }
        URLClassLoader loader = new URLClassLoader("skyrota-plugins", urls.toArray(URL[]::new), parent);
        return new PluginJars(loader, good, problems);
    }

    /** Reads every entry of the jar (checking the CRCs as it goes); returns why it is unusable, or null. */
    private static String checkReadable(Path jar) {
        if (!Files.isReadable(jar)) {
            return "the jar cannot be read";
        }
        byte[] buffer = new byte[8192];
        try (JarFile file = new JarFile(jar.toFile(), true)) {
            Enumeration<JarEntry> entries = file.entries();
            while (entries.hasMoreElements()) {
                JarEntry entry = entries.nextElement();
                try (InputStream in = file.getInputStream(entry)) {
                    while (in.read(buffer) >= 0) {
                        // reading through is what verifies the entry
                    }
                }
            }
            return null;
        } catch (IOException | SecurityException e) {
            return "not a readable jar: " + e.getMessage();
        }
    }

    @Override
    public void close() throws IOException {
        classLoader.close();
    }
}
