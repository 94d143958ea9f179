package dev.contour.picture;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.contour.ContourException;
import dev.contour.eval.Interpreter;
import dev.contour.eval.InterpreterOptions;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.File;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

/** Pole maps through the language: the summary, the SVG (XML, and a real renderer), the PNG and its pixels. */
class PoleMapTest {
    @TempDir
    Path dir;

    /** A made-up amplitude and measure of our own: poles at s = 2 (residue t^2), t = 4 (double), u = 3 with s + t + u = 10. */
    private static final String SETUP = """
            vars s, t, u
            vars x collected
            let m = mellin_measure(gamma: {{(5 - s)/2, 2}, {(6 - t)/2, 1}, {(5 - u)/2, 2}},
                                   kernel: {s/2, t/2 - 3}, eliminate: u, total: 10)
            let A = (t^2/(s - 2) + x/(t - 4)^2 + 1/(u - 3)) at (u = 10 - s - t)
            """;

    private final ByteArrayOutputStream buffer = new ByteArrayOutputStream();

    private String run(String script) {
        buffer.reset();
        Interpreter in = new Interpreter(InterpreterOptions.to(new PrintStream(buffer, true, StandardCharsets.UTF_8)));
        in.run(script, dir.resolve("test.ctr").toString());
        return buffer.toString(StandardCharsets.UTF_8);
    }

    @Test
    void theSummaryListsEachLineWithItsOrderAndResidueDegreeAsThePoleAnalysisFindsThem() {
        String out = run(SETUP + "show poles(A, m)\nshow pole_map(A, m, contour: {1, 1}, title: \"A\")\n");
        // poles(A, m) is the analysis the map is drawn from: the same lines, the same orders
        assertTrue(out.contains("s = 2\n    t = 4 (order 2)\n    u = 3"), out);
        assertTrue(out.contains("s = 2  order 1, residue degree 2"), out);
        assertTrue(out.contains("t = 4  order 2, residue degree 0"), out);
        assertTrue(out.contains("u = 3  order 1, residue degree 0"), out);
        assertTrue(out.contains("contour at Re s = 1, Re t = 1"), out);
    }

    @Test
    void aContourOnAPoleLineIsRefusedWithALocatedError() {
        ContourException e = assertThrows(ContourException.class,
                () -> run(SETUP + "show pole_map(A, m, contour: {2, 1})\n"));
        assertTrue(e.getMessage().contains("lies on the pole line s = 2"), e.getMessage());
        assertEquals(6, e.span().line());
        // the measure's lines count too: Gamma((5 - s)/2) has a pole at s = 5
        ContourException g = assertThrows(ContourException.class,
                () -> run(SETUP + "show pole_map(A, m, contour: {5, 1})\n"));
        assertTrue(g.getMessage().contains("Gamma("), g.getMessage());
    }

    @Test
    void theSvgIsWellFormedXmlAndRendersWithRsvgConvert() throws Exception {
        Path svg = dir.resolve("poles.svg");
        run(SETUP + "show draw(pole_map(A, m, contour: {1, 1}), \"" + svg + "\")\n");
        Document doc = DocumentBuilderFactory.newInstance().newDocumentBuilder().parse(svg.toFile());
        assertEquals("svg", doc.getDocumentElement().getNodeName());
        assertTrue(doc.getElementsByTagName("line").getLength() > 10);
        assertTrue(Files.readString(svg).contains("stroke-dasharray=\"10,5\""), "t lines are dashed");
        boolean present;
        try {
            present = new ProcessBuilder("rsvg-convert", "--version").redirectErrorStream(true).start().waitFor(20, TimeUnit.SECONDS);
        } catch (java.io.IOException e) {
            present = false;
        }
        Assumptions.assumeTrue(present, "rsvg-convert (Debian librsvg2-bin) is not installed: skipping the render check;"
                + " .ci/install-tools installs it");
        Path png = dir.resolve("rendered.png");
        Process p = new ProcessBuilder("rsvg-convert", "-o", png.toString(), svg.toString()).redirectErrorStream(true).start();
        String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(60, TimeUnit.SECONDS));
        assertEquals(0, p.exitValue(), log);
        BufferedImage image = ImageIO.read(png.toFile());
        assertNotNull(image);
        assertEquals(PoleMapDrawing.WIDTH, image.getWidth());
        // the renderer draws the s = 2 line where the layout puts it
        PoleMap map = PoleMapBuilder.build("A", evaluate("A"), measure(), null, null);
        assertTrue(coverage(image, new PoleMapDrawing(map).x(2), 1.0) > 0.9);
    }

    @Test
    void thePngDecodesAndHasAColumnOfLineAtSEqualsTwoAndNotBesideIt() throws Exception {
        Path png = dir.resolve("poles.png");
        run(SETUP + "show draw(pole_map(A, m), \"" + png + "\")\n");
        BufferedImage image = ImageIO.read(png.toFile());
        assertNotNull(image, "the PNG decodes");
        double scale = PictureFiles.PNG_SCALE;
        assertEquals((int) Math.round(PoleMapDrawing.WIDTH * scale), image.getWidth());
        PoleMap map = PoleMapBuilder.build("A", evaluate("A"), measure(), null, null);
        PoleMapDrawing layout = new PoleMapDrawing(map);
        assertTrue(coverage(image, layout.x(2), scale) > 0.95, "a solid column at s = 2");
        assertTrue(coverage(image, layout.x(2.5), scale) < 0.2, "no column at s = 5/2");
        // the t = 4 line is a dashed row: partly covered, far more than an empty row
        assertTrue(rowCoverage(image, layout.y(4), scale) > 0.5);
        assertTrue(rowCoverage(image, layout.y(4.5), scale) < 0.2);
    }

    @Test
    void aPictureIsWrittenWholeOrNotAtAll() {
        Path missing = dir.resolve("no-such-folder").resolve("poles.svg");
        ContourException e = assertThrows(ContourException.class,
                () -> run(SETUP + "show draw(pole_map(A, m), \"" + missing + "\")\n"));
        assertTrue(e.getMessage().contains("cannot write"), e.getMessage());
        assertEquals(6, e.span().line());
        assertFalse(Files.exists(missing));
        ContourException ending = assertThrows(ContourException.class,
                () -> run(SETUP + "show draw(pole_map(A, m), \"" + dir.resolve("poles.pdf") + "\")\n"));
        assertTrue(ending.getMessage().contains(".svg or .png"), ending.getMessage());
        File[] left = dir.toFile().listFiles((d, n) -> n.endsWith(".tmp"));
        assertEquals(0, left == null ? 0 : left.length, "no temporary file is left behind");
    }

    @Test
    void aSymbolicWeightCannotBeDrawnAndSaysWhy() {
        ContourException e = assertThrows(ContourException.class, () -> run("""
                vars s, t, u, p
                let m = mellin_measure(gamma: {{(2*p - s)/2, 2}}, kernel: {s/2, t/2 - p}, eliminate: u, total: 4*p)
                show pole_map(1/(s - 2), m)
                """));
        assertTrue(e.getMessage().contains("'p'"), e.getMessage());
        assertEquals(3, e.span().line());
    }

    /** The share of the plot's height in which the image column at layout x is not background. */
    private static double coverage(BufferedImage image, double x, double scale) {
        int col = (int) Math.round(x * scale);
        int top = (int) Math.round((PoleMapDrawing.TOP + 2) * scale);
        int bottom = (int) Math.round((PoleMapDrawing.TOP + PoleMapDrawing.SIDE - 2) * scale);
        int inked = 0;
        for (int y = top; y < bottom; y++) {
            if (inked(image, col, y) || inked(image, col - 1, y) || inked(image, col + 1, y)) {
                inked++;
            }
        }
        return inked / (double) (bottom - top);
    }

    private static double rowCoverage(BufferedImage image, double y, double scale) {
        int row = (int) Math.round(y * scale);
        int left = (int) Math.round((PoleMapDrawing.LEFT + 2) * scale);
        int right = (int) Math.round((PoleMapDrawing.LEFT + PoleMapDrawing.SIDE - 2) * scale);
        int inked = 0;
        for (int x = left; x < right; x++) {
            if (inked(image, x, row) || inked(image, x, row - 1) || inked(image, x, row + 1)) {
                inked++;
            }
        }
        return inked / (double) (right - left);
    }

    /** Darker than the light grid and the pale contour shading: ink of a pole line. */
    private static boolean inked(BufferedImage image, int x, int y) {
        int rgb = image.getRGB(x, y);
        int r = (rgb >> 16) & 0xff;
        int g = (rgb >> 8) & 0xff;
        int b = rgb & 0xff;
        return (r + g + b) / 3 < 200;
    }

    private dev.contour.algebra.Expression evaluate(String name) {
        Interpreter in = new Interpreter(InterpreterOptions.to(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8)));
        in.run(SETUP, "setup.ctr");
        return ((dev.contour.eval.ExprValue) in.lookup(name)).value();
    }

    private dev.contour.mellin.MellinMeasure measure() {
        Interpreter in = new Interpreter(InterpreterOptions.to(new PrintStream(new ByteArrayOutputStream(), true, StandardCharsets.UTF_8)));
        in.run(SETUP, "setup.ctr");
        return ((dev.contour.mellin.MeasureValue) in.lookup("m")).measure();
    }
}
