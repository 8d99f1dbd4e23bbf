package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.fail;

import java.awt.GraphicsEnvironment;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Properties;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The seed brush as a user drives it, in a real ImageJ with windows ({@link BrushDriver}, in a
 * child JVM with its own home folder), the mouse and keys moved by the {@code xdotool} program
 * ({@link Xdo}): needs a display (CI runs under Xvfb) and {@code xdotool} on the {@code PATH}; with
 * {@code CLEAVE_REQUIRE_DISPLAY=1} a missing display or program fails the test instead of skipping
 * it. The brush width typed into the panel reaches the brush; one foreground stroke and, with Alt
 * held, one background stroke dragged with the mouse along the sample's own seed strokes stay
 * inside their class of the sample's ground truth (sample-images/README.md: nuclei.truth.tif) and
 * give a mask within Dice 0.9 of it; moving the boundary penalty slider up changes the cut to a
 * shorter boundary (a larger λ never lengthens the minimum cut's boundary term; pixel-edge count
 * used as its proxy, common practice, no source); Ctrl+Z on the image undoes the last stroke and
 * its overlay; class 3 chosen in the panel paints class-3 strokes and turns the preview into the
 * three-class expansion with a class-3 contour. Screenshots of the panel and the contour, and the
 * driver's log with the strokes' lengths, are left in {@code target/gui/}.
 */
class SeedBrushGuiTest {
  @Test
  void paintTwoStrokesCreateTheMaskAndSlide(@TempDir Path tmp) throws Exception {
    if (GraphicsEnvironment.isHeadless()) {
      if ("1".equals(System.getenv("CLEAVE_REQUIRE_DISPLAY"))) {
        fail("CLEAVE_REQUIRE_DISPLAY=1 but there is no display: run under xvfb-run");
      }
      Assumptions.abort("no display");
    }
    if (Xdo.find().isEmpty()) {
      if ("1".equals(System.getenv("CLEAVE_REQUIRE_DISPLAY"))) {
        fail("CLEAVE_REQUIRE_DISPLAY=1 but " + Xdo.MISSING);
      }
      Assumptions.abort(Xdo.MISSING);
    }
    Path out = Files.createDirectories(Path.of("target", "gui"));
    Files.deleteIfExists(out.resolve("result.properties"));
    Path log = out.resolve("driver.log"); // kept: it tells the strokes' lengths
    Process p =
        new ProcessBuilder(
                List.of(
                    Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                    "-cp",
                    System.getProperty("java.class.path"),
                    "-Duser.home=" + Files.createDirectories(tmp.resolve("home")),
                    "-Xmx1g",
                    BrushDriver.class.getName(),
                    out.toString()))
            .redirectErrorStream(true)
            .redirectOutput(log.toFile())
            .start();
    if (!p.waitFor(240, TimeUnit.SECONDS)) {
      p.destroyForcibly();
      fail("the seed brush scenario did not finish within 240 s: " + Files.readString(log));
    }
    assertThat(p.exitValue()).as(Files.readString(log)).isZero();
    Properties r = new Properties();
    try (var in = Files.newInputStream(out.resolve("result.properties"))) {
      r.load(in);
    }
    assertThat(r.getProperty("widthField")).isEqualTo("3");
    assertThat(r.getProperty("width")).isEqualTo("3.0");
    assertThat(r.getProperty("stroke1")).isEqualTo("1");
    assertThat(r.getProperty("stroke2")).isEqualTo("2"); // Alt: the other class
    for (String k : new String[] {"foreground", "background"}) {
      // strokes, not dots: the drag follows the seed stroke end to end
      double planned = Double.parseDouble(r.getProperty(k + "Planned"));
      assertThat(planned).as(k).isGreaterThan(10);
      assertThat(Double.parseDouble(r.getProperty(k + "Painted")))
          .as(k)
          .isGreaterThan(0.9 * planned);
    }
    // each stroke stays inside its own class of the ground truth
    assertThat(r.getProperty("strayForeground")).isEqualTo("0");
    assertThat(r.getProperty("strayBackground")).isEqualTo("0");
    assertThat(r.getProperty("status")).contains("flow value = cut value = ", "(checked)");
    assertThat(Double.parseDouble(r.getProperty("dice"))).isGreaterThanOrEqualTo(0.9);
    assertThat(r.getProperty("info")).contains("Made by Cleave", "\"boundaryPenalty\":2.0");
    assertThat(Integer.parseInt(r.getProperty("sliderTo")))
        .isGreaterThan(Integer.parseInt(r.getProperty("sliderFrom")));
    assertThat(r.getProperty("changed")).isEqualTo("true");
    assertThat(Long.parseLong(r.getProperty("boundaryAfter")))
        .isLessThan(Long.parseLong(r.getProperty("boundaryBefore")));
    assertThat(r.getProperty("overlayRestored")).isEqualTo("true");
    // Ctrl+Z on the image with the brush selected undoes the last stroke (ImageJ's Edit > Undo
    // routed to the strokes), and the overlay shows the two strokes before it again
    assertThat(r.getProperty("brushSelected")).isEqualTo("true");
    assertThat(r.getProperty("strokesAfterUndo")).isEqualTo("2");
    assertThat(r.getProperty("overlayStrokesAfterUndo")).isEqualTo("2");
    assertThat(out.resolve("brush-contour.png")).exists();
    // class 3 chosen in the panel: its stroke carries it, the preview expands three classes and
    // draws class 3's contour
    assertThat(r.getProperty("stroke3")).isEqualTo("3");
    assertThat(r.getProperty("classesStatus")).startsWith("3 classes: full re-cut per stroke");
    assertThat(r.getProperty("classContour")).isEqualTo("true");
  }
}
