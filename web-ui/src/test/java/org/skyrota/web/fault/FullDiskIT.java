package org.skyrota.web.fault;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.ServerProcess;

/**
 * The packaged server with its data folder on a small file system that fills up: a write that finds the disk full
 * is a clear 507 problem document and stores nothing, everything stored before stays readable, and once space is
 * freed writing works again. The small file system is a tmpfs mounted for the test, which needs root (the CI
 * machine runs as root); elsewhere the test is skipped, saying why.
 */
class FullDiskIT {

    static final String ADMIN_PASSWORD = "disk-admin-secret";
    static final String ADMIN = ApiClient.basic("admin", ADMIN_PASSWORD);

    @TempDir Path dir;

    @Test
    void aFullDiskRefusesWritesClearlyAndKeepsStoredDataReadable() throws Exception {
        Path disk = dir.resolve("disk");
        Files.createDirectories(disk);
        String mounted = run("mount", "-t", "tmpfs", "-o", "size=32m", "tmpfs", disk.toString());
        assumeTrue(mounted == null, "Full-disk test skipped: cannot mount a 32 MiB tmpfs here (" + mounted + ")");
        Path filler = disk.resolve("filler");
        try (ServerProcess server = ServerProcess.start(disk.resolve("data"), dir.resolve("server.log"),
                Map.of("SKYROTA_ADMIN_PASSWORD", ADMIN_PASSWORD))) {
            ApiClient api = new ApiClient(server.port());
            List<Long> stored = new ArrayList<>();
            stored.add(site(api, "Before the disk filled", "[]").id("$.id"));

            fill(filler);
            // The database file still has room of its own inside; bigger and bigger writes use it up.
            String horizon = horizon(700);
            Answer refused = null;
            String refusedName = null;
            for (int i = 0; i < 300 && refused == null; i++) {
                String name = "While full " + i;
                Answer a = site(api, name, horizon);
                if (a.status() == 201) {
                    stored.add(a.id("$.id"));
                } else {
                    refused = a;
                    refusedName = name;
                }
            }
            assertThat(refused).as("a write failed once the disk was full").isNotNull();
            assertThat(refused.status()).as(refused.body()).isEqualTo(507);
            assertThat(refused.contentType()).startsWith("application/problem+json");
            assertThat((String) refused.json("$.type")).isEqualTo("urn:skyrota:problem:storage-full");
            assertThat((String) refused.json("$.detail")).contains("disk is full").contains("nothing of this change was stored");

            // Everything acknowledged is there; the refused write left nothing. The database may be opening again
            // for a moment after the failed write (503 with Retry-After), never answering wrongly.
            for (long id : stored) {
                Answer back = readSoon(api, "/api/sites/" + id);
                assertThat(back.status()).as(back.body()).isEqualTo(200);
            }
            Answer none = readSoon(api, "/api/sites?name=" + refusedName.replace(" ", "%20"));
            assertThat(((Number) none.json("$.totalItems")).intValue()).isZero();

            Files.delete(filler);
            Answer again = null;
            for (int i = 0; i < 20 && (again == null || again.status() != 201); i++) {
                again = site(api, "After space was freed " + i, "[]");
                if (again.status() != 201) {
                    assertThat(again.status()).as(again.body()).isIn(503, 507);
                    Thread.sleep(500);
                }
            }
            assertThat(again.status()).as(again.body()).isEqualTo(201);
            assertThat(server.log()).contains("Disk full answering POST /api/sites: nothing was stored");
        } finally {
            run("umount", "-l", disk.toString());
        }
    }

    private static Answer site(ApiClient api, String name, String horizon) {
        return api.post("/api/sites", ADMIN, "{\"name\":\"" + name + "\",\"latitudeDeg\":45,\"longitudeDeg\":7,"
                + "\"elevationM\":100,\"timeZone\":\"UTC\",\"horizon\":" + horizon + "}");
    }

    private static Answer readSoon(ApiClient api, String path) throws InterruptedException {
        Answer a = api.get(path, ADMIN);
        for (int i = 0; i < 20 && a.status() == 503; i++) {
            assertThat(a.body()).contains("try again");
            Thread.sleep(250);
            a = api.get(path, ADMIN);
        }
        return a;
    }

    private static String horizon(int points) {
        StringBuilder out = new StringBuilder("[");
        for (int i = 0; i < points; i++) {
            out.append(i == 0 ? "" : ",").append("{\"azimuthDeg\":").append(i * 0.5).append(",\"altitudeDeg\":5}");
        }
        return out.append(']').toString();
    }

    /** Writes zeros until the file system says it is full. */
    private static void fill(Path filler) {
        byte[] block = new byte[1 << 20];
        try (OutputStream out = Files.newOutputStream(filler)) {
            while (true) {
                out.write(block);
            }
        } catch (IOException full) {
            assertThat(full.getMessage()).containsIgnoringCase("space");
        }
    }

    /** Runs a command; null when it succeeded, else what it printed. */
    private static String run(String... command) {
        try {
            Process p = new ProcessBuilder(command).redirectErrorStream(true).start();
            String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).trim();
            return p.waitFor() == 0 ? null : "exit " + p.exitValue() + ": " + output;
        } catch (IOException e) {
            return e.getMessage();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return "interrupted";
        }
    }
}
