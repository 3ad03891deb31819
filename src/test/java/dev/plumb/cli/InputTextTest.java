package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/** Text as editors save it: a byte-order mark, old Mac line endings, and control characters kept inert. */
class InputTextTest {

    private static Run check(byte[] content) throws IOException {
        Path dir = Files.createTempDirectory("plumb-text");
        Path file = dir.resolve("text.plumb");
        Files.write(file, content);
        try {
            return Run.of("check", "--no-color", file.toString());
        } finally {
            Files.deleteIfExists(file);
            Files.deleteIfExists(dir);
        }
    }

    @Test
    void aDashReadsStandardInput() {
        java.io.InputStream saved = System.in;
        try {
            System.setIn(new java.io.ByteArrayInputStream("param M [kg] > 0\nclaim c: M = N\n".getBytes(StandardCharsets.UTF_8)));
            Run run = Run.of("check", "--no-color", "-");
            assertTrue(run.all().contains("<stdin>:2:14: error: 'N' is not defined"), run.all());
            assertEquals(2, run.status());
        } finally {
            System.setIn(saved);
        }
    }

    @Test
    void aByteOrderMarkIsAccepted() throws IOException {
        Run run = check(("\uFEFFparam M [kg] > 0\nclaim c: M = M\n").getBytes(StandardCharsets.UTF_8));
        assertEquals(0, run.status(), run.all());
    }

    @Test
    void carriageReturnLineEndingsAreLocatedOnTheirOwnLines() throws IOException {
        Run run = check("param M [kg] > 0\rclaim c: M = N\r".getBytes(StandardCharsets.UTF_8));
        assertTrue(run.all().contains("text.plumb:2:14: error: 'N' is not defined"), run.all());
        Run crlf = check("param M [kg] > 0\r\nclaim c: M = N\r\n".getBytes(StandardCharsets.UTF_8));
        assertTrue(crlf.all().contains("text.plumb:2:14: error: 'N' is not defined"), crlf.all());
    }

    @Test
    void aLongLineIsQuotedInAWindowAroundTheColumn() throws IOException {
        Run run = check(("param x > 0\nclaim c: " + "x + ".repeat(250) + "y = x\n").getBytes(StandardCharsets.UTF_8));
        String quoted = run.all().lines().filter(l -> l.startsWith("    ...")).findFirst().orElseThrow(() -> new AssertionError(run.all()));
        assertTrue(quoted.length() < 200, quoted);
        assertTrue(quoted.contains("y = x"), quoted);
        String carets = run.all().lines().filter(l -> l.trim().equals("^")).findFirst().orElseThrow();
        assertEquals('y', quoted.charAt(carets.indexOf('^')), "the caret stands under the unknown name");
    }

    @Test
    void aFloodOfErrorsIsCounted() throws IOException {
        Run run = check("bogus line\n".repeat(500).getBytes(StandardCharsets.UTF_8));
        assertTrue(run.all().contains("... and 450 more diagnostics not shown"), run.all().substring(0, 200));
        assertEquals(2, run.status());
    }

    @Test
    void escapeSequencesFromTheFileNeverReachTheTerminal() throws IOException {
        Run run = check("title \"\u001b[31mALL HOLD\u001b[0m\"\nparam M [kg] > 0\nclaim c: M = N\n".getBytes(StandardCharsets.UTF_8));
        assertFalse(run.all().contains("\u001b"), run.all());
        assertTrue(run.all().contains("\\u001b[31mALL HOLD"), run.all());
    }
}
