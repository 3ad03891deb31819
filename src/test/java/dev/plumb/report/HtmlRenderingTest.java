package dev.plumb.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.plumb.cli.Main;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Every HTML report of the shipped derivations and the examples, laid out by headless Chromium at a
 * phone's width (375 CSS pixels): each MathML element is one the browser knows as MathML and takes
 * room, each plot takes room and its text is laid out, the page never needs sideways scrolling (wide
 * tables scroll inside their own box), and the browser reports nothing on its console.
 *
 * <p>All pages go into one browser run: each is the {@code srcdoc} of a frame of a harness page (a
 * frame gets the phone's width whatever the window's least width is), and a script in the harness
 * writes what it measured into the page, which {@code --dump-dom} prints.
 */
class HtmlRenderingTest {

    private static final int PHONE_WIDTH = 375;

    /** One measured element: which report, which kind, its size, whether the browser took it for MathML/SVG. */
    private record Measured(String report, String tag, double width, double height, boolean recognised, int texts, int textsLaidOut) { }

    @Test
    void everyReportLaysOutItsMathematicsAndPlotsAtPhoneWidthWithoutConsoleMessages(@TempDir Path dir) throws Exception {
        var chromium = ExternalTool.find("chromium", "chromium-browser", "google-chrome", "google-chrome-stable");
        Assumptions.assumeTrue(chromium.isPresent(),
                "Chromium is not installed (CI installs Debian's 'chromium' package); the HTML rendering checks are skipped");
        Map<String, String> pages = new LinkedHashMap<>();
        List<Path> inputs = new ArrayList<>();
        for (String folder : List.of("derivations", "examples")) {
            try (Stream<Path> s = Files.list(Path.of(folder))) {
                inputs.addAll(s.filter(p -> p.toString().endsWith(".plumb")).sorted().toList());
            }
        }
        for (Path input : inputs) {
            String name = input.getFileName().toString().replace(".plumb", "");
            Path out = dir.resolve(input.getParent().getFileName() + "-" + name);
            int status = Main.run(new String[] {"report", input.toString(), "--format", "html", "--out", out.toString()},
                    new PrintWriter(new StringWriter()), new PrintWriter(new StringWriter()));
            Path html = out.resolve(name + ".html");
            if (status == 2) {
                // Input that cannot be understood gets no report at all (examples/broken-*).
                assertFalse(Files.exists(html), input + " exits 2 yet wrote a report");
                continue;
            }
            assertTrue(Files.exists(html), input + " wrote no HTML report (exit " + status + ")");
            pages.put(input.toString(), Files.readString(html));
        }
        assertTrue(pages.keySet().stream().filter(k -> k.startsWith("derivations")).count() >= 10, pages.keySet().toString());

        Files.writeString(dir.resolve("harness.html"), harness(pages));
        var r = chromium.get().run(dir, List.of("--headless", "--disable-gpu", "--no-sandbox", "--hide-scrollbars",
                "--window-size=800,900", "--enable-logging=stderr", "--v=0", "--dump-dom", dir.resolve("harness.html").toUri().toString()));
        Matcher m = Pattern.compile("<pre id=\"plumb-measure\">(.*?)</pre>", Pattern.DOTALL).matcher(r.out());
        assertTrue(m.find(), () -> "the harness wrote no measurements; Chromium said:\n" + r.err());
        // Chromium writes console messages (script errors, SVG attributes it cannot read, blocked resources) as CONSOLE lines.
        List<String> console = r.err().lines().filter(l -> l.contains(":CONSOLE")).toList();
        assertEquals(List.of(), console, "console messages while rendering the reports");

        List<Measured> measured = new ArrayList<>();
        Map<String, int[]> pageWidths = new LinkedHashMap<>();
        Map<String, Integer> unwrappedTables = new LinkedHashMap<>();
        for (String line : unescape(m.group(1)).split("\n")) {
            if (line.isBlank()) continue;
            String[] f = line.split("\t");
            String report = List.copyOf(pages.keySet()).get(Integer.parseInt(f[0]));
            switch (f[1]) {
                case "page" -> {
                    pageWidths.put(report, new int[] {Integer.parseInt(f[2]), Integer.parseInt(f[3])});
                    unwrappedTables.put(report, Integer.parseInt(f[4]));
                }
                default -> measured.add(new Measured(report, f[1], Double.parseDouble(f[2]), Double.parseDouble(f[3]),
                        f[4].equals("1"), Integer.parseInt(f[5]), Integer.parseInt(f[6])));
            }
        }
        assertEquals(pages.keySet(), pageWidths.keySet(), "every page was measured");
        for (String report : pages.keySet()) {
            int[] w = pageWidths.get(report);
            assertTrue(w[0] <= w[1], report + ": the page is " + w[0] + " px wide in a " + w[1] + " px frame (sideways scrolling)");
            assertEquals(0, unwrappedTables.get(report), report + ": tables outside a scrolling wrapper");
            List<Measured> math = measured.stream().filter(x -> x.report().equals(report) && x.tag().equals("math")).toList();
            assertFalse(math.isEmpty(), report + ": no MathML at all");
            long figures = countOf(pages.get(report), "<figure");
            assertEquals(figures, measured.stream().filter(x -> x.report().equals(report) && x.tag().equals("svg")).count(),
                    report + ": one drawing per figure");
        }
        for (Measured x : measured) {
            String what = x.report() + ": a <" + x.tag() + "> ";
            assertTrue(x.recognised(), what + "that the browser does not take for " + (x.tag().equals("math") ? "MathML" : "SVG"));
            assertTrue(x.width() > 0 && x.height() > 0, what + "laid out " + x.width() + " × " + x.height());
            if (x.tag().equals("svg")) {
                assertTrue(x.width() <= PHONE_WIDTH, what + "wider than the phone: " + x.width());
                assertTrue(x.texts() >= 5, what + "with " + x.texts() + " text elements");
                assertEquals(x.texts(), x.textsLaidOut(), what + "with text that takes no room");
            }
        }
    }

    private static long countOf(String s, String what) {
        return Pattern.compile(Pattern.quote(what)).matcher(s).results().count();
    }

    /**
     * The harness: one frame per report at phone width, and a script that, once every frame has
     * loaded, writes one tab-separated line per page and per {@code math} and {@code svg} element.
     */
    private static String harness(Map<String, String> pages) {
        StringBuilder s = new StringBuilder("<!DOCTYPE html>\n<html><head><meta charset=\"utf-8\"/></head><body>\n");
        int i = 0;
        for (String page : pages.values()) {
            s.append("<iframe data-n=\"").append(i++).append("\" style=\"width:").append(PHONE_WIDTH)
                    .append("px;height:900px;border:0;display:block\" srcdoc=\"").append(attribute(page)).append("\"></iframe>\n");
        }
        s.append("""
                <script>
                window.addEventListener('load', function () {
                  const lines = [];
                  document.querySelectorAll('iframe').forEach(function (frame) {
                    const n = frame.dataset.n, w = frame.contentWindow, d = frame.contentDocument;
                    const unwrapped = Array.from(d.querySelectorAll('table'))
                        .filter(t => !(t.parentElement && t.parentElement.classList.contains('scroll')
                            && w.getComputedStyle(t.parentElement).overflowX === 'auto')).length;
                    lines.push([n, 'page', d.documentElement.scrollWidth, d.documentElement.clientWidth, unwrapped].join('\\t'));
                    d.querySelectorAll('math, svg').forEach(function (el) {
                      const r = el.getBoundingClientRect();
                      const isMath = el.tagName.toLowerCase() === 'math';
                      const native = isMath ? (typeof w.MathMLElement !== 'undefined' && el instanceof w.MathMLElement)
                                            : el instanceof w.SVGSVGElement;
                      const texts = Array.from(el.querySelectorAll('text'));
                      const laidOut = texts.filter(t => { const b = t.getBBox(); return b.width > 0 && b.height > 0; }).length;
                      lines.push([n, isMath ? 'math' : 'svg', r.width, r.height, native ? 1 : 0, texts.length, laidOut].join('\\t'));
                    });
                  });
                  const pre = document.createElement('pre');
                  pre.id = 'plumb-measure';
                  pre.textContent = lines.join('\\n');
                  document.body.appendChild(pre);
                });
                </script>
                </body></html>
                """);
        return s.toString();
    }

    private static String attribute(String s) {
        return s.replace("&", "&amp;").replace("\"", "&quot;").replace("<", "&lt;").replace(">", "&gt;");
    }

    private static String unescape(String s) {
        return s.replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", "\"").replace("&amp;", "&");
    }
}
