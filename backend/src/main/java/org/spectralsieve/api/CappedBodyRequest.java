package org.spectralsieve.api;

import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import java.io.IOException;

/**
 * A request whose body stream fails with {@link JsonBodyTooLargeException} past {@code limit} bytes: the cap
 * for a body that gave no length up front (chunked), which the length check cannot see.
 */
final class CappedBodyRequest extends HttpServletRequestWrapper {

    private final long limit;
    private ServletInputStream capped;

    CappedBodyRequest(HttpServletRequest request, long limit) {
        super(request);
        this.limit = limit;
    }

    @Override
    public ServletInputStream getInputStream() throws IOException {
        if (capped == null) {
            capped = new Capped(super.getInputStream(), limit);
        }
        return capped;
    }

    private static final class Capped extends ServletInputStream {
        private final ServletInputStream in;
        private final long limit;
        private long read;

        Capped(ServletInputStream in, long limit) {
            this.in = in;
            this.limit = limit;
        }

        @Override
        public int read() throws IOException {
            int b = in.read();
            if (b >= 0) {
                count(1);
            }
            return b;
        }

        @Override
        public int read(byte[] buffer, int offset, int length) throws IOException {
            int n = in.read(buffer, offset, length);
            if (n > 0) {
                count(n);
            }
            return n;
        }

        private void count(int n) throws JsonBodyTooLargeException {
            read += n;
            if (read > limit) {
                throw new JsonBodyTooLargeException(limit);
            }
        }

        @Override
        public boolean isFinished() {
            return in.isFinished();
        }

        @Override
        public boolean isReady() {
            return in.isReady();
        }

        @Override
        public void setReadListener(ReadListener listener) {
            in.setReadListener(listener);
        }
    }
}
