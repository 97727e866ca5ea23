package org.spectralsieve.search;

import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Brings the search store up to date after a committed write on one background thread, so that the writer's request
 * (an import holding one of the gate's few turns) does not wait for the rebuild (docs/search-under-load.md, eighth
 * pass). Requests made while a refresh is already queued are one: the queued refresh reads the change counter when
 * it runs, so it covers every write committed before that. A request made while a refresh runs queues one more
 * (the running one may have read the counter before that write).
 *
 * <p>Freshness never depends on it: every search reads the change counter and rebuilds when it moved
 * (docs/freshness.md). A refresh lost on shutdown leaves the next search to rebuild.
 */
public final class BackgroundRefresh implements Runnable, AutoCloseable {

    private final Runnable refresh;
    private final AtomicBoolean queued = new AtomicBoolean();
    private final ExecutorService thread = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "search-store-refresh");
        t.setDaemon(true);
        return t;
    });

    /** @param refresh what brings the store up (the search service's refresh, which logs its own failures) */
    public BackgroundRefresh(Runnable refresh) {
        this.refresh = refresh;
    }

    /** Asks for a refresh; returns at once. */
    @Override
    public void run() {
        if (!queued.compareAndSet(false, true)) {
            return; // one is queued and not started: it reads the counter after this write
        }
        try {
            thread.execute(() -> {
                queued.set(false); // cleared before reading the counter: a later write queues one more
                refresh.run();
            });
        } catch (RejectedExecutionException closing) {
            queued.set(false); // shutting down: the next search rebuilds
        }
    }

    @Override
    public void close() {
        thread.shutdown();
    }
}
