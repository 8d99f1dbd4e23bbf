package io.github.cleave.bench;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.segment.IlluminationMode;
import io.github.cleave.segment.PhaseTimings;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.zip.CRC32;

/**
 * Whole-pipeline benchmark: {@link Segmenter#segment} on generated phantoms in a warm JVM, with the
 * phases of {@link PhaseTimings} (flatten, learn, costs, build, solve, objects, measure) and the
 * wall-clock total of the call, each the median over the repeats after the warm-up runs. Prints a
 * Markdown table, one row per case.
 *
 * <p>Cases: {@code 2d} is {@link SamplePhantoms#nuclei} at 1024 × 1024 (16-bit grey, its own
 * strokes as seeds), 8-neighbourhood; {@code 3d} is {@link SamplePhantoms#stack} at 256 × 256 × 64,
 * 6-neighbourhood, cut as a volume. Each is run with illumination OFF (no flattening) and AUTO (the
 * default), and with 0, 1 and the default 3 refinement rounds; every other setting is the default.
 * The column {@code per round} is {@code (total − total with 0 rounds) / rounds}. The {@code mask}
 * column is a CRC-32 of the foreground mask, so that runs before and after a change to the code can
 * be compared for bit-identical results (it must also agree between the repeats of one case).
 *
 * <p>Arguments ({@code key=value}, any order): {@code cases=2d,3d}, {@code rounds=0,1,3}, {@code
 * illumination=OFF,AUTO}, {@code warmup=3}, {@code repeats=7}, {@code seed=20261202}, {@code
 * out=FILE} (also write the table there). The word {@code all} is ignored.
 */
public final class PipelineBenchmark {
  private PipelineBenchmark() {}

  public static void main(String[] args) throws IOException {
    Map<String, String> options = new LinkedHashMap<>();
    options.put("cases", "2d,3d");
    options.put("rounds", "0,1,3");
    options.put("illumination", "OFF,AUTO");
    options.put("warmup", "3");
    options.put("repeats", "7");
    options.put("seed", Long.toString(SamplePhantoms.DEFAULT_SEED));
    options.put("out", "");
    BenchOptions.apply(options, args);
    int warmup = Integer.parseInt(options.get("warmup"));
    int repeats = Integer.parseInt(options.get("repeats"));
    long seed = Long.parseLong(options.get("seed"));

    List<String> lines = new ArrayList<>();
    lines.add(BenchOptions.machine());
    lines.add("");
    lines.add(
        "| case | illumination | rounds | flatten | learn | costs | build | solve | objects |"
            + " measure | total | per round | mask |");
    lines.add("|---|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---|");
    System.out.println(lines.get(0));
    for (String name : options.get("cases").split(",")) {
      Phantom phantom =
          switch (name) {
            case "2d" -> SamplePhantoms.nuclei(seed, 1024, 1024);
            case "3d" -> SamplePhantoms.stack(seed, 256, 256, 64);
            default -> throw new IllegalArgumentException("case " + name + ": use 2d or 3d");
          };
      String label =
          String.format(
              Locale.ROOT,
              "%s %dx%dx%d n%d",
              name,
              phantom.image().width(),
              phantom.image().height(),
              phantom.image().depth(),
              name.equals("2d") ? 8 : 6);
      for (String mode : options.get("illumination").split(",")) {
        double zeroRoundTotal = Double.NaN;
        for (String r : options.get("rounds").split(",")) {
          int rounds = Integer.parseInt(r);
          SegmentationSettings settings =
              SegmentationSettings.defaults()
                  .withNeighborhood(name.equals("2d") ? 8 : 6)
                  .withRefinementRounds(rounds)
                  .withIllumination(
                      IlluminationMode.valueOf(mode), SegmentationSettings.DEFAULT_FLATTEN_RADIUS);
          double[] medians = run(phantom.image(), phantom.seeds(), settings, warmup, repeats);
          double total = medians[7];
          if (rounds == 0) {
            zeroRoundTotal = total;
          }
          StringBuilder row = new StringBuilder();
          row.append("| ").append(label).append(" | ").append(mode).append(" | ").append(rounds);
          for (int i = 0; i < 8; i++) {
            row.append(" | ").append(fmt(medians[i]));
          }
          row.append(" | ")
              .append(rounds == 0 ? "-" : fmt((total - zeroRoundTotal) / rounds))
              .append(" | ")
              .append(String.format(Locale.ROOT, "%08x", (long) medians[8]))
              .append(" |");
          lines.add(row.toString());
          System.out.println(row);
        }
      }
    }
    String table = String.join("\n", lines) + "\n";
    System.out.println();
    System.out.print(table);
    if (!options.get("out").isEmpty()) {
      Files.writeString(Path.of(options.get("out")), table);
    }
  }

  /**
   * Medians in ms of the seven phases and of the wall-clock total, then the mask's CRC-32 (index
   * 8).
   */
  private static double[] run(
      Raster image, SeedLabels seeds, SegmentationSettings settings, int warmup, int repeats) {
    long crc = -1;
    for (int i = 0; i < warmup; i++) {
      crc = checkSame(crc, Segmenter.segment(image, seeds, settings));
    }
    long[][] nanos = new long[8][repeats];
    for (int i = 0; i < repeats; i++) {
      Timing.heapUsed(); // collect outside the timed call
      long start = System.nanoTime();
      Segmentation s = Segmenter.segment(image, seeds, settings);
      nanos[7][i] = System.nanoTime() - start;
      PhaseTimings t = s.timings();
      double[] ms = {
        t.flattenMs(),
        t.learnMs(),
        t.costsMs(),
        t.buildMs(),
        t.solveMs(),
        t.objectsMs(),
        t.measureMs()
      };
      for (int k = 0; k < ms.length; k++) {
        nanos[k][i] = Math.round(ms[k] * 1e6);
      }
      crc = checkSame(crc, s);
    }
    double[] medians = new double[9];
    for (int k = 0; k < 8; k++) {
      medians[k] = Timing.medianMs(nanos[k]);
    }
    medians[8] = crc;
    return medians;
  }

  private static long checkSame(long previous, Segmentation s) {
    CRC32 crc = new CRC32();
    crc.update(s.mask());
    long value = crc.getValue();
    if (previous >= 0 && previous != value) {
      throw new IllegalStateException("the mask differs between repeats of the same case");
    }
    return value;
  }

  private static String fmt(double value) {
    return String.format(Locale.ROOT, "%.1f", value);
  }
}
