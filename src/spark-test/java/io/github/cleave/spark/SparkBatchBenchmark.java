package io.github.cleave.spark;

import io.github.cleave.bench.BenchOptions;
import io.github.cleave.cli.BatchFixtures;
import io.github.cleave.io.ModelFiles;
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
import org.apache.spark.api.java.JavaSparkContext;

/**
 * Throughput of the cluster job against the local folder run, on one machine: {@code images}
 * generated 16-bit grey images of {@code size × size} (the recipe of the folder-run benchmark:
 * {@link SamplePhantoms#nuclei} with seeds 1000, 1001, ..., TIFF without seed files; a model
 * learned once from {@code SamplePhantoms.nuclei(seed)} with default settings). For each Spark
 * master in {@code masters} (one context at a time, started before any timing): one warm-up, then
 * {@code repeats} rounds, each timing {@code batch --threads N} (N = the master's cores) and the
 * job on that context, alternately, each into a fresh output folder. Prints medians, images per
 * second and the job's overhead against {@code batch} ({@code time(job) / time(batch) - 1}), with
 * the system load average before and after.
 *
 * <p>Arguments ({@code key=value}): {@code images=200}, {@code size=512}, {@code
 * masters=local[1],local[2]}, {@code repeats=3}, {@code perPartition=4}, {@code seed=20261202},
 * {@code dir=} (work folder; default a temporary one). The word {@code all} is ignored.
 */
public final class SparkBatchBenchmark {
  private SparkBatchBenchmark() {}

  public static void main(String[] args) throws IOException {
    Map<String, String> o = new LinkedHashMap<>();
    o.put("images", "200");
    o.put("size", "512");
    o.put("masters", "local[1];local[2]");
    o.put("repeats", "3");
    o.put("perPartition", "4");
    o.put("seed", Long.toString(SamplePhantoms.DEFAULT_SEED));
    o.put("dir", "");
    BenchOptions.apply(o, args);
    int images = Integer.parseInt(o.get("images"));
    int size = Integer.parseInt(o.get("size"));
    int repeats = Integer.parseInt(o.get("repeats"));
    Path dir =
        o.get("dir").isEmpty()
            ? Files.createTempDirectory("cleave-spark-bench")
            : Files.createDirectories(Path.of(o.get("dir")));
    Path in = Files.createDirectories(dir.resolve("in"));
    for (int i = 0; i < images; i++) {
      String name = String.format(Locale.ROOT, "img-%03d", i);
      SampleWriter.write(SamplePhantoms.nuclei(1000 + i, size, size), in, name);
      Files.delete(in.resolve(name + ".seeds.tif"));
      Files.delete(in.resolve(name + ".truth.tif"));
    }
    Phantom learnFrom = SamplePhantoms.nuclei(Long.parseLong(o.get("seed")), size, size);
    Path model = dir.resolve("model.json");
    ModelFiles.write(
        model,
        Segmenter.learn(learnFrom.image(), learnFrom.seeds(), SegmentationSettings.defaults()));
    double loadBefore = load();
    List<String> rows = new ArrayList<>();
    int run = 0;
    for (String master : o.get("masters").split(";")) {
      int cores = cores(master);
      JavaSparkContext sc = SparkFixtures.context(master);
      try {
        double[] local = new double[repeats];
        double[] cluster = new double[repeats];
        for (int r = -1; r < repeats; r++) {
          String[] batchArgs =
              common(model, in, dir.resolve("out-" + run++), "--threads", Integer.toString(cores));
          String[] jobArgs =
              common(
                  model,
                  in,
                  dir.resolve("out-" + run++),
                  "--files-per-partition",
                  o.get("perPartition"));
          double b = time(() -> SparkFixtures.batch(batchArgs));
          double s = time(() -> SparkFixtures.job(sc, jobArgs));
          BatchFixtures.deleteTree(dir.resolve("out-" + (run - 2)));
          BatchFixtures.deleteTree(dir.resolve("out-" + (run - 1)));
          if (r >= 0) {
            local[r] = b;
            cluster[r] = s;
          }
        }
        rows.add(row("batch --threads " + cores, local, images, Double.NaN));
        rows.add(row("job, " + master, cluster, images, median(local)));
      } finally {
        sc.stop();
      }
    }
    System.out.println(BenchOptions.machine());
    System.out.println(
        String.format(
            Locale.ROOT,
            "%d images of %d x %d, 16-bit grey, default model; %s files per partition; load"
                + " average %.2f before, %.2f after",
            images,
            size,
            size,
            o.get("perPartition"),
            loadBefore,
            load()));
    System.out.println();
    System.out.println("| run | median s | images/s | overhead vs batch | runs (s) |");
    System.out.println("|---|---:|---:|---:|---|");
    rows.forEach(System.out::println);
    if (o.get("dir").isEmpty()) {
      BatchFixtures.deleteTree(dir);
    }
  }

  private interface Body {
    SparkFixtures.Run run();
  }

  private static double time(Body body) {
    long start = System.nanoTime();
    SparkFixtures.Run r = body.run();
    double seconds = (System.nanoTime() - start) / 1e9;
    if (r.exit() != 0) {
      throw new IllegalStateException("exit " + r.exit() + ": " + r.err());
    }
    return seconds;
  }

  private static String[] common(Path model, Path in, Path out, String... extra) {
    List<String> a =
        new ArrayList<>(
            List.of("--model", model.toString(), "--in", in.toString(), "--out", out.toString()));
    a.addAll(List.of(extra));
    return a.toArray(String[]::new);
  }

  private static String row(String name, double[] seconds, int images, double batchMedian) {
    double m = median(seconds);
    List<String> runs = new ArrayList<>();
    for (double s : seconds) {
      runs.add(String.format(Locale.ROOT, "%.2f", s));
    }
    return String.format(
        Locale.ROOT,
        "| %s | %.2f | %.1f | %s | %s |",
        name,
        m,
        images / m,
        Double.isNaN(batchMedian)
            ? "-"
            : String.format(Locale.ROOT, "%+.1f %%", 100 * (m / batchMedian - 1)),
        String.join(", ", runs));
  }

  private static double median(double[] values) {
    double[] s = values.clone();
    Arrays.sort(s);
    return s.length % 2 == 1 ? s[s.length / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
  }

  private static int cores(String master) {
    String inner = master.replaceAll("^local\\[([^,\\]]*).*$", "$1");
    return inner.equals("*") ? Runtime.getRuntime().availableProcessors() : Integer.parseInt(inner);
  }

  private static double load() {
    return ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
  }
}
