package dev.fixmod.verify.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The HTML report of the built-in spec opens in headless Chromium and its SVG charts are drawn: the screenshot holds
 * the series colours of the charts, not just text. Skipped, with a message, where Chromium is not installed.
 */
class LossReportBrowserTest {
    @TempDir
    Path dir;

    private static Path chromium() {
        for (String c : List.of("/usr/bin/chromium", "/usr/bin/chromium-browser", "/usr/bin/google-chrome")) {
            if (Files.isExecutable(Path.of(c))) {
                return Path.of(c);
            }
        }
        String message = "SKIPPED: no Chromium found (/usr/bin/chromium); skipping the browser check of report.html";
        System.err.println(message);
        Assumptions.abort(message);
        throw new AssertionError("unreachable");
    }

    @Test
    void chartsRenderInHeadlessChromium() throws IOException, InterruptedException {
        Path browser = chromium();
        Path out = dir.resolve("report");
        LossCommandTest.Run r = LossCommandTest.run("loss", "-o", out.toString(), "--quiet");
        assertEquals(0, r.status(), r.err());
        Path png = dir.resolve("shot.png");
        Process p = new ProcessBuilder(browser.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update",
                "--disable-sync", "--user-data-dir=" + dir.resolve("profile"), "--screenshot=" + png,
                "--window-size=1200,2000", out.resolve("report.html").toUri().toString())
                .redirectErrorStream(true).redirectOutput(dir.resolve("chromium.log").toFile()).start();
        try {
            assertTrue(p.waitFor(90, TimeUnit.SECONDS), "Chromium did not finish within 90 s");
        } finally {
            p.destroyForcibly();
        }
        assertTrue(Files.size(png) > 0, Files.readString(dir.resolve("chromium.log")));
        BufferedImage image = ImageIO.read(png.toFile());
        assertEquals(1200, image.getWidth());
        // The charts lie below the headline and the sizing table; count what they paint there.
        int blue = 0;
        int green = 0;
        int nonWhite = 0;
        Set<Integer> colours = new HashSet<>();
        for (int y = 400; y < image.getHeight(); y++) {
            for (int x = 0; x < 800; x++) {
                int rgb = image.getRGB(x, y) & 0xFFFFFF;
                colours.add(rgb);
                if (rgb != 0xFFFFFF) {
                    nonWhite++;
                }
                blue += near(rgb, 0x1f77b4) ? 1 : 0;
                green += near(rgb, 0x2ca02c) ? 1 : 0;
            }
        }
        assertTrue(blue > 500, "series blue pixels: " + blue);
        assertTrue(green > 300, "series green pixels: " + green);
        assertTrue(nonWhite > 20_000, "non-white pixels: " + nonWhite);
        assertTrue(colours.size() > 50, "distinct colours: " + colours.size());
    }

    private static boolean near(int rgb, int target) {
        int dr = ((rgb >> 16) & 0xFF) - ((target >> 16) & 0xFF);
        int dg = ((rgb >> 8) & 0xFF) - ((target >> 8) & 0xFF);
        int db = (rgb & 0xFF) - (target & 0xFF);
        return dr * dr + dg * dg + db * db < 900;
    }
}
