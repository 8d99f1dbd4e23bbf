package io.github.cleave.bench;

import io.github.cleave.batch.BatchListener;
import io.github.cleave.batch.BatchResult;
import io.github.cleave.batch.BatchRunner;
import io.github.cleave.batch.BatchSettings;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.segment.IlluminationMode;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;

/**
 * Folder-run benchmark: {@link BatchRunner} end to end (read, segment, write every per-image and
 * folder output) on {@code images} generated 16-bit grey images of {@code size × size} ({@link
 * SamplePhantoms#nuclei} with seeds 1000, 1001, ..., written as TIFF without their seed files, so
 * the model alone decides), with a model learned once from {@code SamplePhantoms.nuclei(seed)} with
 * default settings. For each thread count: warm-up runs, then repeats, each into a fresh output
 * folder; prints the median wall-clock time, images per second, and the parallel efficiency
 * relative to the first thread count ({@code rate(n) / (n / n1 · rate(n1))}), with the system load
 * average before the runs.
 *
 * <p>Arguments ({@code key=value}): {@code images=24}, {@code size=512}, {@code threads=1,2},
 * {@code warmup=1}, {@code repeats=3}, {@code seed=20261202}, {@code dir=} (work folder; default a
 * temporary one), {@code rounds=3} (refinement rounds of the model, the default), {@code
 * illumination=AUTO} (the model's flattening setting: AUTO flattens these unevenly lit phantoms,
 * OFF never flattens), {@code lighting=ramp} (the images: {@code ramp} the default nuclei
 * phantoms with their illumination ramp, {@code even} the same nuclei evenly lit, {@link
 * SamplePhantoms#nucleiEvenlyLit}, as flat-field-corrected screens record them; the model is learned
 * on a phantom of the same kind). The word {@code all} is ignored.
 */
public final class BatchBenchmark {
  private BatchBenchmark() {}

  public static void main(String[] args) throws IOException {
    Map<String, String> o = new LinkedHashMap<>();
    o.put("images", "24");
    o.put("size", "512");
    o.put("threads", "1,2");
    o.put("warmup", "1");
    o.put("repeats", "3");
    o.put("seed", Long.toString(SamplePhantoms.DEFAULT_SEED));
    o.put("dir", "");
    o.put("rounds", Integer.toString(SegmentationSettings.defaults().refinementRounds()));
    o.put("illumination", "AUTO");
    o.put("lighting", "ramp");
    BenchOptions.apply(o, args);
    int images = Integer.parseInt(o.get("images"));
    int size = Integer.parseInt(o.get("size"));
    int warmup = Integer.parseInt(o.get("warmup"));
    int repeats = Integer.parseInt(o.get("repeats"));
    long seed = Long.parseLong(o.get("seed"));
    Path dir =
        o.get("dir").isEmpty()
            ? Files.createTempDirectory("cleave-batch-bench")
            : Files.createDirectories(Path.of(o.get("dir")));
    Path in = Files.createDirectories(dir.resolve("in"));
    for (int i = 0; i < images; i++) {
      String name = String.format(Locale.ROOT, "img-%03d", i);
      SampleWriter.write(phantom(o.get("lighting"), 1000 + i, size), in, name);
      Files.delete(in.resolve(name + ".seeds.tif"));
      Files.delete(in.resolve(name + ".truth.tif"));
    }
    Phantom learnFrom = phantom(o.get("lighting"), seed, size);
    Path model = dir.resolve("model.json");
    ModelFiles.write(
        model,
        Segmenter.learn(
            learnFrom.image(),
            learnFrom.seeds(),
            SegmentationSettings.defaults().toBuilder()
                .refinementRounds(Integer.parseInt(o.get("rounds")))
                .build()
                .withIllumination(
                    IlluminationMode.valueOf(o.get("illumination")),
                    SegmentationSettings.DEFAULT_FLATTEN_RADIUS)));

    double load = ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
    System.out.println(BenchOptions.machine());
    System.out.println(
        String.format(
            Locale.ROOT,
            "%d images of %d x %d, 16-bit grey, lighting %s; model with %s refinement rounds,"
                + " illumination %s; load average before the runs %.2f",
            images,
            size,
            size,
            o.get("lighting"),
            o.get("rounds"),
            o.get("illumination"),
            load));
    System.out.println();
    System.out.println("| threads | median s | images/s | efficiency | runs (s) |");
    System.out.println("|---:|---:|---:|---:|---|");
    double firstRate = Double.NaN;
    int firstThreads = 0;
    int run = 0;
    for (String t : o.get("threads").split(",")) {
      int threads = Integer.parseInt(t.strip());
      double[] seconds = new double[repeats];
      for (int r = -warmup; r < repeats; r++) {
        Path out = dir.resolve("out-" + run++);
        BatchSettings s = new BatchSettings(model, in, out, null, threads, null, false, true, 0);
        long start = System.nanoTime();
        BatchResult result = new BatchRunner(s, BatchListener.NONE).run();
        double elapsed = (System.nanoTime() - start) / 1e9;
        if (!result.allSucceeded()) {
          throw new IllegalStateException(result.failedCount() + " file(s) failed");
        }
        deleteTree(out);
        if (r >= 0) {
          seconds[r] = elapsed;
        }
      }
      double[] sorted = seconds.clone();
      Arrays.sort(sorted);
      double median = sorted[repeats / 2];
      double rate = images / median;
      if (Double.isNaN(firstRate)) {
        firstRate = rate;
        firstThreads = threads;
      }
      double efficiency = rate / (firstRate * threads / firstThreads);
      List<String> runs = new ArrayList<>();
      for (double s : seconds) {
        runs.add(String.format(Locale.ROOT, "%.2f", s));
      }
      System.out.println(
          String.format(
              Locale.ROOT,
              "| %d | %.2f | %.1f | %.2f | %s |",
              threads,
              median,
              rate,
              efficiency,
              String.join(", ", runs)));
    }
    if (o.get("dir").isEmpty()) {
      deleteTree(dir);
    }
  }

  private static void deleteTree(Path dir) throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      for (Path p : s.sorted((a, b) -> b.compareTo(a)).toList()) {
        Files.delete(p);
      }
    }
  }

  private static Phantom phantom(String lighting, long seed, int size) {
    return switch (lighting) {
      case "ramp" -> SamplePhantoms.nuclei(seed, size, size);
      case "even" -> SamplePhantoms.nucleiEvenlyLit(seed, size, size);
      default -> throw new IllegalArgumentException("lighting " + lighting + ": use ramp or even");
    };
  }
}
