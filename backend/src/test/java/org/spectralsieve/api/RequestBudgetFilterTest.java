package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequestWrapper;
import java.io.ByteArrayInputStream;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;
import org.spectralsieve.ingest.ImportGate;
import org.spectralsieve.ingest.ImportProperties;
import org.springframework.mock.web.MockHttpServletRequest;
import org.springframework.mock.web.MockHttpServletResponse;

/**
 * An import waiting for a turn holds none of its upload: the filter takes the turn before anything reads the
 * body, so the queue's length costs no heap for uploads (docs/limits.md, "Imports"). The turn is held by the
 * test through the gate itself and the waiting import is seen by the gate's own count, so nothing depends on
 * timing.
 */
class RequestBudgetFilterTest {

    @Test
    void anImportWaitingForATurnHasReadNoByteOfItsUploadAndReadsItOnceItsTurnComes() throws Exception {
        ImportGate gate = new ImportGate(1, 4, TimeUnit.MINUTES.toMillis(5));
        RequestBudgetFilter filter = new RequestBudgetFilter(gate, ImportProperties.defaults());
        byte[] upload = new byte[256 * 1024];
        AtomicLong bytesRead = new AtomicLong();
        MockHttpServletRequest request = new MockHttpServletRequest("POST", "/api/imports");
        request.setContentType("multipart/form-data; boundary=x");
        CountingRequest counted = new CountingRequest(request, upload, bytesRead);
        AtomicBoolean ranWithTurn = new AtomicBoolean();
        Thread waiting;
        try (ImportGate.Turn held = gate.enter()) {
            waiting = new Thread(() -> {
                try {
                    filter.doFilter(counted, new MockHttpServletResponse(), (req, res) -> {
                        ranWithTurn.set(true);
                        req.getInputStream().readAllBytes(); // the multipart parser, once the turn came
                    });
                } catch (Exception e) {
                    throw new IllegalStateException(e);
                }
            });
            waiting.start();
            while (gate.waiting() == 0) {
                Thread.onSpinWait();
            }
            assertThat(bytesRead.get()).as("bytes of the upload read while waiting").isZero();
            assertThat(ranWithTurn).isFalse();
        }
        waiting.join();
        assertThat(ranWithTurn).isTrue();
        assertThat(bytesRead.get()).isEqualTo(upload.length);
    }

    /** A request whose body counts the bytes read from it. */
    private static final class CountingRequest extends HttpServletRequestWrapper {
        private final ServletInputStream in;

        CountingRequest(MockHttpServletRequest request, byte[] body, AtomicLong bytesRead) {
            super(request);
            ByteArrayInputStream bytes = new ByteArrayInputStream(body);
            this.in = new ServletInputStream() {
                @Override
                public int read() {
                    int b = bytes.read();
                    if (b >= 0) {
                        bytesRead.incrementAndGet();
                    }
                    return b;
                }

                @Override
                public int read(byte[] buffer, int off, int len) {
                    int n = bytes.read(buffer, off, len);
                    if (n > 0) {
                        bytesRead.addAndGet(n);
                    }
                    return n;
                }

                @Override
                public boolean isFinished() {
                    return bytes.available() == 0;
                }

                @Override
                public boolean isReady() {
                    return true;
                }

                @Override
                public void setReadListener(ReadListener listener) {
                    throw new UnsupportedOperationException();
                }
            };
        }

        @Override
        public ServletInputStream getInputStream() {
            return in;
        }
    }
}
