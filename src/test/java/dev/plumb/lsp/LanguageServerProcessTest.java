package dev.plumb.lsp;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/**
 * {@code plumb lsp} as its own process, as an editor starts it: standard output carries protocol
 * messages and nothing else, even when the editor sends a message that is not JSON (which the
 * protocol library reports through its logger), and standard error stays quiet without
 * {@code --debug}.
 */
class LanguageServerProcessTest {

    private static void send(OutputStream to, String json) throws IOException {
        byte[] body = json.getBytes(StandardCharsets.UTF_8);
        to.write(("Content-Length: " + body.length + "\r\n\r\n").getBytes(StandardCharsets.US_ASCII));
        to.write(body);
        to.flush();
    }

    /** Splits standard output into protocol messages; fails on anything that is not one. */
    private static List<String> frames(byte[] out) {
        List<String> frames = new ArrayList<>();
        int i = 0;
        while (i < out.length) {
            String rest = new String(out, i, Math.min(200, out.length - i), StandardCharsets.US_ASCII);
            assertTrue(rest.startsWith("Content-Length: "), "not a protocol message at byte " + i + ": " + rest);
            int headerEnd = rest.indexOf("\r\n\r\n");
            int length = Integer.parseInt(rest.substring("Content-Length: ".length(), rest.indexOf("\r\n")));
            int start = i + headerEnd + 4;
            frames.add(new String(out, start, length, StandardCharsets.UTF_8));
            i = start + length;
        }
        return frames;
    }

    @Test
    void standardOutputCarriesOnlyTheProtocolAndNothingIsLogged() throws Exception {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process server = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"), "dev.plumb.cli.Main", "lsp").start();
        CompletableFuture<byte[]> out = CompletableFuture.supplyAsync(() -> readAll(server.getInputStream()));
        CompletableFuture<byte[]> err = CompletableFuture.supplyAsync(() -> readAll(server.getErrorStream()));
        OutputStream in = server.getOutputStream();
        send(in, "{\"jsonrpc\":\"2.0\",\"id\":1,\"method\":\"initialize\",\"params\":{\"capabilities\":{}}}");
        send(in, "{this is not json");
        send(in, "{\"jsonrpc\":\"2.0\",\"method\":\"textDocument/didOpen\",\"params\":{\"textDocument\":{\"uri\":\"file:///t/a.plumb\","
                + "\"languageId\":\"plumb\",\"version\":1,\"text\":\"param M [kgg] > 0\\n\"}}}");
        send(in, "{\"jsonrpc\":\"2.0\",\"method\":\"no/suchNotification\",\"params\":{}}");
        send(in, "{\"jsonrpc\":\"2.0\",\"id\":2,\"method\":\"shutdown\"}");
        send(in, "{\"jsonrpc\":\"2.0\",\"method\":\"exit\"}");
        assertTrue(server.waitFor(300, TimeUnit.SECONDS), "the server ends on 'exit'");
        in.close();
        assertEquals(0, server.exitValue(), "exit after shutdown is status 0");

        List<String> frames = frames(out.get(60, TimeUnit.SECONDS));
        assertTrue(frames.stream().anyMatch(f -> f.contains("\"id\":1") && f.contains("\"hoverProvider\":true")), frames.toString());
        assertTrue(frames.stream().anyMatch(f -> f.contains("\"id\":2") && f.contains("\"result\":null")), frames.toString());
        String stderr = new String(err.get(60, TimeUnit.SECONDS), StandardCharsets.UTF_8);
        assertEquals("", stderr, "nothing on standard error without --debug");
    }

    private static byte[] readAll(InputStream s) {
        ByteArrayOutputStream b = new ByteArrayOutputStream();
        try {
            s.transferTo(b);
        } catch (IOException e) {
            // the process ended
        }
        return b.toByteArray();
    }
}
