package org.skyrota.web.run;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.http.MediaType;
import org.springframework.stereotype.Component;
import org.springframework.web.servlet.mvc.method.annotation.SseEmitter;

/**
 * The server-sent event streams of the runs: {@code progress} with each new best plan, one {@code done} at the end.
 * A stream opened after the run ended gets the last progress and {@code done} at once.
 */
@Component
class RunEvents {

    private static final Logger log = LoggerFactory.getLogger(RunEvents.class);

    /** How long a stream may stay open beyond the run's own time limit. */
    private static final long SLACK_MILLIS = 120_000;

    private static final class Channel {
        final List<SseEmitter> emitters = new ArrayList<>();
        String lastProgress;
        String done;
    }

    private final Map<Long, Channel> channels = new ConcurrentHashMap<>();

    private Channel channel(long runId) {
        return channels.computeIfAbsent(runId, id -> new Channel());
    }

    /**
     * @param doneIfEnded the {@code done} data to send when the run has already ended (read from storage), or null
     *                    while it is still queued or running
     */
    SseEmitter subscribe(long runId, int timeLimitSeconds, String doneIfEnded) {
        SseEmitter emitter = new SseEmitter(timeLimitSeconds * 1000L + SLACK_MILLIS);
        Channel ch = channel(runId);
        // The callbacks go on before the emitter is shared, so that none of its endings can be missed.
        Runnable remove = () -> {
            synchronized (ch) {
                ch.emitters.remove(emitter);
            }
        };
        emitter.onCompletion(remove);
        emitter.onTimeout(remove);
        emitter.onError(e -> remove.run());
        synchronized (ch) {
            if (ch.lastProgress != null) {
                send(emitter, "progress", ch.lastProgress);
            }
            String done = ch.done != null ? ch.done : doneIfEnded;
            if (done != null) {
                send(emitter, "done", done);
                emitter.complete();
                return emitter;
            }
            ch.emitters.add(emitter);
        }
        return emitter;
    }

    void progress(long runId, String data) {
        Channel ch = channel(runId);
        synchronized (ch) {
            ch.lastProgress = data;
            ch.emitters.removeIf(e -> {
                if (send(e, "progress", data)) {
                    return false;
                }
                // Close it rather than leave the reader waiting for a done that would never come.
                closeQuietly(e);
                return true;
            });
        }
    }

    void done(long runId, String data) {
        Channel ch = channel(runId);
        synchronized (ch) {
            ch.done = data;
            for (SseEmitter e : ch.emitters) {
                send(e, "done", data);
                closeQuietly(e);
            }
            ch.emitters.clear();
        }
    }

    private static boolean send(SseEmitter emitter, String name, String data) {
        try {
            emitter.send(SseEmitter.event().name(name).data(data, MediaType.APPLICATION_JSON));
            return true;
        } catch (IOException | IllegalStateException e) {
            // the reader went away; the run goes on
            log.debug("Could not send {} to a run's event stream: {}", name, e.toString());
            return false;
        }
    }

    private static void closeQuietly(SseEmitter emitter) {
        try {
            emitter.complete();
        } catch (IllegalStateException e) {
            log.debug("Event stream already closed: {}", e.toString());
        }
    }
}
