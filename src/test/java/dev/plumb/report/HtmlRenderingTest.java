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

    private static ExternalTool chromium() {
        var chromium = ExternalTool.find("chromium", "chromium-browser", "google-chrome", "google-chrome-stable");
        Assumptions.assumeTrue(chromium.isPresent(),
                "Chromium is not installed (CI installs Debian's 'chromium' package); the HTML rendering checks are skipped");
        return chromium.get();
    }

    @Test
    void everyReportLaysOutItsMathematicsAndPlotsAtPhoneWidthWithoutConsoleMessages(@TempDir Path dir) throws Exception {
        ExternalTool chromium = chromium();
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
        assertTrue(pages.values().stream().anyMatch(h -> h.contains("<figure")), "some report has a plot");
        assertEquals(List.of(), problems(chromium, dir, pages));
    }

    @Test
    void theChecksFindAPageThatIsLaidOutBadly(@TempDir Path dir) throws Exception {
        ExternalTool chromium = chromium();
        // The good page is made by the report's own markup: a wide table, an equation and a plot.
        HtmlMarkup html = new HtmlMarkup();
        html.heading(1, "A page made well");
        html.table(List.of("a", "b", "c", "d", "e", "f"), List.of(java.util.Collections.nCopies(6,
                Markup.Cell.text("a cell wide enough that six of them overflow a phone"))));
        html.equation("balance", dev.plumb.lang.Parser.parseExpression("P'(r)"), "=", dev.plumb.lang.Parser.parseExpression("-G*m(r)*rho/r^2"));
        html.figure("plot", "A plot.", SvgPlotTest.sphere(), new LinkedHashMap<>());
        html.footer("Caution: a footer.");
        String good = html.finish();
        String bad = "<!DOCTYPE html><html><head><meta charset=\"utf-8\"/></head><body>"
                + "<math></math><table><tr><td>a table outside any scrolling box</td></tr></table>"
                + "<div style=\"width:700px\">wider than a phone</div>"
                + "<figure><svg xmlns=\"http://www.w3.org/2000/svg\" width=\"100\" height=\"50\">"
                + "<polyline points=\"a,b\"/><text x=\"5\" y=\"20\"></text></svg></figure><figure>no drawing</figure></body></html>";
        Map<String, String> pages = new LinkedHashMap<>();
        pages.put("good", good);
        pages.put("bad", bad);
        List<String> found = problems(chromium, dir, pages);
        String all = String.join("\n", found);
        assertFalse(all.contains("good:"), all);
        for (String expected : List.of("console", "bad: the page is", "bad: 1 table(s) outside", "bad: a <math> laid out 0",
                "bad: 1 drawing(s) for 2 figure(s)", "with 1 text elements", "text that takes no room")) {
            assertTrue(all.contains(expected), "'" + expected + "' not among:\n" + all);
        }
    }

    /** Everything wrong with the pages as Chromium lays them out: one sentence per problem, naming the page. */
    private static List<String> problems(ExternalTool chromium, Path dir, Map<String, String> pages) throws Exception {
        Files.writeString(dir.resolve("harness.html"), harness(pages));
        var r = chromium.run(dir, List.of("--headless", "--disable-gpu", "--no-sandbox", "--hide-scrollbars",
                "--window-size=800,900", "--enable-logging=stderr", "--v=0", "--dump-dom", dir.resolve("harness.html").toUri().toString()));
        Matcher m = Pattern.compile("<pre id=\"plumb-measure\">(.*?)</pre>", Pattern.DOTALL).matcher(r.out());
        assertTrue(m.find(), () -> "the harness wrote no measurements; Chromium said:\n" + r.err());
        List<String> problems = new ArrayList<>();
        // Chromium writes console messages (script errors, SVG attributes it cannot read, blocked resources) as CONSOLE lines.
        r.err().lines().filter(l -> l.contains(":CONSOLE")).forEach(l -> problems.add("console: " + l));

        List<String> names = List.copyOf(pages.keySet());
        List<Measured> measured = new ArrayList<>();
        Map<String, String[]> pageLines = new LinkedHashMap<>();
        for (String line : unescape(m.group(1)).split("\n")) {
            if (line.isBlank()) continue;
            String[] f = line.split("\t");
            String report = names.get(Integer.parseInt(f[0]));
            if (f[1].equals("page")) {
                pageLines.put(report, f);
            } else {
                measured.add(new Measured(report, f[1], Double.parseDouble(f[2]), Double.parseDouble(f[3]),
                        f[4].equals("1"), Integer.parseInt(f[5]), Integer.parseInt(f[6])));
            }
        }
        for (String report : names) {
            String[] f = pageLines.get(report);
            if (f == null) {
                problems.add(report + ": not measured");
                continue;
            }
            int scrollWidth = Integer.parseInt(f[2]), clientWidth = Integer.parseInt(f[3]), unwrapped = Integer.parseInt(f[4]);
            if (scrollWidth > clientWidth) {
                problems.add(report + ": the page is " + scrollWidth + " px wide in a " + clientWidth + " px frame (sideways scrolling)");
            }
            if (unwrapped > 0) problems.add(report + ": " + unwrapped + " table(s) outside a box that scrolls sideways");
            if (measured.stream().noneMatch(x -> x.report().equals(report) && x.tag().equals("math"))) {
                problems.add(report + ": no MathML at all");
            }
            long figures = countOf(pages.get(report), "<figure");
            long drawings = measured.stream().filter(x -> x.report().equals(report) && x.tag().equals("svg")).count();
            if (figures != drawings) problems.add(report + ": " + drawings + " drawing(s) for " + figures + " figure(s)");
        }
        for (Measured x : measured) {
            String what = x.report() + ": a <" + x.tag() + "> ";
            if (!x.recognised()) problems.add(what + "that the browser does not take for " + (x.tag().equals("math") ? "MathML" : "SVG"));
            if (!(x.width() > 0 && x.height() > 0)) problems.add(what + "laid out " + x.width() + " × " + x.height());
            if (x.tag().equals("svg")) {
                if (x.width() > PHONE_WIDTH) problems.add(what + "wider than the phone: " + x.width());
                if (x.texts() < 5) problems.add(what + "with " + x.texts() + " text elements");
                if (x.textsLaidOut() < x.texts()) problems.add(what + "with text that takes no room");
            }
        }
        return problems;
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
