package org.spectralsieve.search;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

/**
 * The store's refresh after a write runs off the writer's thread, requests while one is queued are one, and a request
 * made while a refresh runs still gets a refresh that starts after it (so a write committed after the running refresh
 * read the change counter is brought up too).
 */
class BackgroundRefreshTest {

    @Test
    void aRequestReturnsAtOnceAndTheRefreshRunsOnAnotherThread() throws Exception {
        CountDownLatch ran = new CountDownLatch(1);
        Thread[] on = new Thread[1];
        try (BackgroundRefresh refresh = new BackgroundRefresh(() -> {
            on[0] = Thread.currentThread();
            ran.countDown();
        })) {
            refresh.run();
            assertThat(ran.await(10, TimeUnit.SECONDS)).isTrue();
            assertThat(on[0]).isNotSameAs(Thread.currentThread());
        }
    }

    @Test
    void requestsWhileOneIsQueuedAreOneAndARequestDuringARefreshQueuesAnother() throws Exception {
        CountDownLatch started = new CountDownLatch(1);
        CountDownLatch release = new CountDownLatch(1);
        AtomicInteger runs = new AtomicInteger();
        CountDownLatch second = new CountDownLatch(2);
        try (BackgroundRefresh refresh = new BackgroundRefresh(() -> {
            if (runs.incrementAndGet() == 1) {
                started.countDown();
                await(release);
            }
            second.countDown();
        })) {
            refresh.run();
            assertThat(started.await(10, TimeUnit.SECONDS)).isTrue();
            // the first refresh is running: these 20 requests come after it read the counter, so one more must run
            for (int i = 0; i < 20; i++) {
                refresh.run();
            }
            release.countDown();
            assertThat(second.await(10, TimeUnit.SECONDS)).as("a refresh after the writes made during the first").isTrue();
            Thread.sleep(200); // room for any extra refresh to (wrongly) start
            assertThat(runs.get()).as("20 requests while one was queued ran as one").isEqualTo(2);
        }
    }

    private static void await(CountDownLatch latch) {
        try {
            latch.await(10, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }
}
