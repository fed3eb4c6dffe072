package org.skyrota.web.run;

import java.io.IOException;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicBoolean;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.http.MediaType;
import org.springframework.stereotype.Component;
import org.springframework.web.servlet.mvc.method.annotation.SseEmitter;

/**
 * The server-sent event streams of the runs: {@code progress} with each new best plan, one {@code done} at the end.
 * A stream opened after the run ended gets the last progress and {@code done} at once.
 *
 * <p>No lock of ours is held while an emitter is written to or closed: the servlet container runs an emitter's
 * completion, timeout and error callbacks under locks of its own, and a callback that waited for a lock held by a
 * writer waiting for the container would stop the planner's worker for good. Instead every stream is added before
 * it looks for {@code done}, and {@code done} is recorded before the streams are walked, so each stream sees it at
 * least once; a flag per stream makes it exactly once.
 */
@Component
class RunEvents {

    private static final Logger log = LoggerFactory.getLogger(RunEvents.class);

    /** How long a stream may stay open beyond the run's own time limit. */
    private static final long SLACK_MILLIS = 120_000;

    private static final class Channel {
        final Set<Stream> streams = ConcurrentHashMap.newKeySet();
        volatile String lastProgress;
        volatile String done;
    }

    private record Stream(SseEmitter emitter, AtomicBoolean ended) {

        void progress(String data) {
            if (!ended.get() && !send(emitter, "progress", data)) {
                // Close it rather than leave the reader waiting for a done that would never come.
                end(null);
            }
        }

        void end(String done) {
            if (ended.compareAndSet(false, true)) {
                if (done != null) {
                    send(emitter, "done", done);
                }
                try {
                    emitter.complete();
                } catch (IllegalStateException e) {
                    log.debug("Event stream already closed: {}", e.toString());
                }
            }
        }
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
        Stream stream = new Stream(emitter, new AtomicBoolean());
        Runnable forget = () -> ch.streams.remove(stream);
        emitter.onCompletion(forget);
        emitter.onTimeout(forget);
        emitter.onError(e -> forget.run());
        ch.streams.add(stream);
        String progress = ch.lastProgress;
        if (progress != null) {
            stream.progress(progress);
        }
        String done = ch.done != null ? ch.done : doneIfEnded;
        if (done != null) {
            stream.end(done);
            ch.streams.remove(stream);
        }
        return emitter;
    }

    void progress(long runId, String data) {
        Channel ch = channel(runId);
        ch.lastProgress = data;
        for (Stream s : ch.streams) {
            s.progress(data);
        }
    }

    void done(long runId, String data) {
        Channel ch = channel(runId);
        ch.done = data;
        for (Stream s : ch.streams) {
            s.end(data);
        }
        ch.streams.clear();
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
}
