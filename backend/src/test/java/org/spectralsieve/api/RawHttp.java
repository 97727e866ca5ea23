package org.spectralsieve.api;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * HTTP/1.1 over a plain socket, for requests an HTTP client refuses to send (an encoded slash, a bad Host,
 * a 100 KB query string): the request bytes go out exactly as given.
 */
final class RawHttp {

    record Answer(int status, Map<String, String> headers, String body) {
        String header(String name) {
            return headers.get(name.toLowerCase(Locale.ROOT));
        }
    }

    private RawHttp() {
    }

    /** @param head request line and headers, without the final blank line; Connection: close is added */
    static Answer send(int port, String head, byte[] body) throws IOException {
        try (Socket socket = new Socket("127.0.0.1", port)) {
            socket.setSoTimeout(60_000);
            OutputStream out = socket.getOutputStream();
            StringBuilder h = new StringBuilder(head.replace("\n", "\r\n"));
            if (!head.toLowerCase(Locale.ROOT).contains("\nhost:")) {
                h.append("\r\nHost: localhost");
            }
            h.append("\r\nConnection: close");
            if (body != null && !head.toLowerCase(Locale.ROOT).contains("transfer-encoding:")) {
                h.append("\r\nContent-Length: ").append(body.length);
            }
            h.append("\r\n\r\n");
            out.write(h.toString().getBytes(StandardCharsets.ISO_8859_1));
            try {
                if (body != null) {
                    out.write(body);
                }
                out.flush();
            } catch (IOException e) {
                // the server may answer and close before reading the whole body; its answer still counts
            }
            return read(socket.getInputStream());
        }
    }

    static Answer get(int port, String rawTarget) throws IOException {
        return send(port, "GET " + rawTarget + " HTTP/1.1", null);
    }

    static Answer post(int port, String path, String contentType, byte[] body) throws IOException {
        return send(port, "POST " + path + " HTTP/1.1\nContent-Type: " + contentType, body);
    }

    private static Answer read(InputStream in) throws IOException {
        ByteArrayOutputStream all = new ByteArrayOutputStream();
        try {
            in.transferTo(all);
        } catch (IOException e) {
            // a reset after the answer was sent; parse what arrived
        }
        byte[] bytes = all.toByteArray();
        int split = indexOf(bytes, "\r\n\r\n".getBytes(StandardCharsets.ISO_8859_1));
        if (split < 0) {
            throw new IOException("no complete answer: " + new String(bytes, StandardCharsets.ISO_8859_1));
        }
        String[] lines = new String(bytes, 0, split, StandardCharsets.ISO_8859_1).split("\r\n");
        int status = Integer.parseInt(lines[0].split(" ")[1]);
        Map<String, String> headers = new LinkedHashMap<>();
        for (int i = 1; i < lines.length; i++) {
            int colon = lines[i].indexOf(':');
            headers.put(lines[i].substring(0, colon).strip().toLowerCase(Locale.ROOT), lines[i].substring(colon + 1).strip());
        }
        byte[] body = java.util.Arrays.copyOfRange(bytes, split + 4, bytes.length);
        if ("chunked".equalsIgnoreCase(headers.get("transfer-encoding"))) {
            body = unchunk(body);
        }
        return new Answer(status, headers, new String(body, StandardCharsets.UTF_8));
    }

    private static byte[] unchunk(byte[] chunked) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        int at = 0;
        while (at < chunked.length) {
            int eol = indexOf(java.util.Arrays.copyOfRange(chunked, at, chunked.length), new byte[] {'\r', '\n'});
            if (eol < 0) {
                break;
            }
            String sizeText = new String(chunked, at, eol, StandardCharsets.ISO_8859_1).split(";")[0].strip();
            int size = Integer.parseInt(sizeText, 16);
            at += eol + 2;
            if (size == 0) {
                break;
            }
            out.write(chunked, at, Math.min(size, chunked.length - at));
            at += size + 2;
        }
        return out.toByteArray();
    }

    private static int indexOf(byte[] bytes, byte[] pattern) {
        outer:
        for (int i = 0; i + pattern.length <= bytes.length; i++) {
            for (int j = 0; j < pattern.length; j++) {
                if (bytes[i + j] != pattern[j]) {
                    continue outer;
                }
            }
            return i;
        }
        return -1;
    }
}
