package org.skyrota.web.system;

import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;

import org.hibernate.engine.spi.SessionFactoryImplementor;
import org.hibernate.event.service.spi.EventListenerRegistry;
import org.hibernate.event.spi.EventType;
import org.hibernate.event.spi.PostCommitDeleteEventListener;
import org.hibernate.event.spi.PostCommitInsertEventListener;
import org.hibernate.event.spi.PostCommitUpdateEventListener;
import org.hibernate.event.spi.PostDeleteEvent;
import org.hibernate.event.spi.PostInsertEvent;
import org.hibernate.event.spi.PostUpdateEvent;
import org.hibernate.persister.entity.EntityPersister;
import org.springframework.stereotype.Component;

import jakarta.persistence.EntityManagerFactory;

/**
 * Counts committed changes per stored class, so that a view built from stored rows can be kept until one of the
 * classes it reads from changes. A count is raised only after the change is committed: a reader that takes the count
 * before it reads the rows can never keep a view older than the count says.
 *
 * <p>Only changes made through this server's persistence context are seen. Skyrota writes all its rows that way
 * (no bulk or native updates), and one server owns its database; a view kept this way should also expire by age,
 * for anyone who edits the database by hand.
 */
@Component
public class StoredChanges implements PostCommitInsertEventListener, PostCommitUpdateEventListener,
        PostCommitDeleteEventListener {

    private final Map<Class<?>, AtomicLong> inserts = new ConcurrentHashMap<>();
    private final Map<Class<?>, AtomicLong> updatesAndDeletes = new ConcurrentHashMap<>();

    StoredChanges(EntityManagerFactory entityManagerFactory) {
        EventListenerRegistry registry = entityManagerFactory.unwrap(SessionFactoryImplementor.class)
                .getEventListenerRegistry();
        registry.appendListeners(EventType.POST_COMMIT_INSERT, this);
        registry.appendListeners(EventType.POST_COMMIT_UPDATE, this);
        registry.appendListeners(EventType.POST_COMMIT_DELETE, this);
    }

    /** Committed updates and deletes of rows of {@code type} since the start. */
    public long updatedOrDeleted(Class<?> type) {
        return counter(updatesAndDeletes, type).get();
    }

    /** Committed inserts, updates and deletes of rows of {@code type} since the start. */
    public long anyChange(Class<?> type) {
        return counter(inserts, type).get() + counter(updatesAndDeletes, type).get();
    }

    private static AtomicLong counter(Map<Class<?>, AtomicLong> counts, Class<?> type) {
        return counts.computeIfAbsent(type, t -> new AtomicLong());
    }

    private static Class<?> typeOf(EntityPersister persister) {
        return persister.getMappedClass();
    }

    @Override
    public void onPostInsert(PostInsertEvent event) {
        counter(inserts, typeOf(event.getPersister())).incrementAndGet();
    }

    @Override
    public void onPostUpdate(PostUpdateEvent event) {
        counter(updatesAndDeletes, typeOf(event.getPersister())).incrementAndGet();
    }

    @Override
    public void onPostDelete(PostDeleteEvent event) {
        counter(updatesAndDeletes, typeOf(event.getPersister())).incrementAndGet();
    }

    // A change that did not commit changes nothing a reader could see; it still raises the count, which costs
    // at most one rebuilt view and keeps the rule simple.
    @Override
    public void onPostInsertCommitFailed(PostInsertEvent event) {
        onPostInsert(event);
    }

    @Override
    public void onPostUpdateCommitFailed(PostUpdateEvent event) {
        onPostUpdate(event);
    }

    @Override
    public void onPostDeleteCommitFailed(PostDeleteEvent event) {
        onPostDelete(event);
    }

    @Override
    public boolean requiresPostCommitHandling(EntityPersister persister) {
        return true;
    }
}
