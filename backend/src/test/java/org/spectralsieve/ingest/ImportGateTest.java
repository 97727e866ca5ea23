package org.spectralsieve.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/** The import gate: a bounded number at work, a bounded number waiting, the rest told to come back. */
class ImportGateTest {

    @Test
    void aWaitingImportGetsTheTurnWhenTheOneAtWorkFinishes() throws Exception {
        ImportGate gate = new ImportGate(1, 1, 30_000);
        ImportGate.Turn first = gate.enter();
        CountDownLatch entered = new CountDownLatch(1);

        CompletableFuture<Void> second = CompletableFuture.runAsync(() -> {
            try (ImportGate.Turn turn = gate.enter()) {
                entered.countDown();
            }
        });
        assertThat(entered.await(200, TimeUnit.MILLISECONDS)).as("waits while the first holds the turn").isFalse();
        first.close();

        assertThat(entered.await(30, TimeUnit.SECONDS)).isTrue();
        second.get(30, TimeUnit.SECONDS);
    }

    @Test
    void anImportBeyondTheQueueIsTurnedAwayAtOnceWithARetryTime() throws Exception {
        ImportGate gate = new ImportGate(1, 0, 30_000);
        try (ImportGate.Turn held = gate.enter()) {
            assertThatThrownBy(gate::enter).isInstanceOfSatisfying(ImportGate.Busy.class, busy -> {
                assertThat(busy.retryAfterSeconds()).isPositive();
                assertThat(busy.inFlight()).isEqualTo(1);
                assertThat(busy.getMessage()).contains("sieve.imports.max-concurrent-imports");
            });
        }
        try (ImportGate.Turn again = gate.enter()) {
            assertThat(again).as("the turn is free again once released").isNotNull();
        }
    }

    @Test
    void aWaitThatRunsOutIsTurnedAwayNamingTheSetting() {
        ImportGate gate = new ImportGate(1, 4, 50);
        try (ImportGate.Turn held = gate.enter()) {
            assertThatThrownBy(gate::enter).isInstanceOf(ImportGate.Busy.class)
                    .hasMessageContaining("sieve.imports.queue-wait-seconds");
        }
    }
}
