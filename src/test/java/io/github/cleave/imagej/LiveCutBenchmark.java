package io.github.cleave.imagej;

import ij.plugin.filter.ThresholdToSelection;
import ij.process.ByteProcessor;
import ij.process.ImageProcessor;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.model.ModelKind;
import io.github.cleave.model.ModelLearner;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.StrokeGenerator;
import java.util.Arrays;
import java.util.Locale;

/**
 * Stroke release to contour on a 1-megapixel plane, the seed brush's fast path without the event
 * thread: rasterise the strokes, dynamic re-solve of the kept cut (with its certificate check),
 * contour as a selection. Not a test (no timing in tests); run by hand:
 *
 * <pre>
 * java -cp target/test-classes:target/classes:CLASSPATH io.github.cleave.imagej.LiveCutBenchmark
 * </pre>
 *
 * <p>Image: {@code SamplePhantoms.nuclei(seed, 1024, 1024)}; strokes: the phantom's own two
 * foreground and two background strokes first (learn + full solve), then one 3-pixel-wide stroke
 * per object along the longest row of its generated stroke ({@code StrokeGenerator
 * .strokesPerObject}), each timed from release to contour. Prints the median and the quartiles.
 */
public final class LiveCutBenchmark {
  private LiveCutBenchmark() {}

  public static void main(String[] args) {
    int size = args.length > 0 ? Integer.parseInt(args[0]) : 1024;
    Phantom p = SamplePhantoms.nuclei(SamplePhantoms.DEFAULT_SEED, size, size);
    int w = size;
    int h = size;
    SeedLabels perObject =
        StrokeGenerator.strokesPerObject(
            p.truthLabels(), p.image().channel(0), w, h, 1, SamplePhantoms.DEFAULT_SEED);
    var features = p.image().selectChannels(new int[] {p.drivingChannel()});
    SeedStrokes strokes = new SeedStrokes(w, h, 1);
    byte[] first = p.seeds().labels();
    for (int label = 1; label <= 2; label++) {
      int[] run = StrokePlan.longestRun(first, w, h, label);
      strokes.add(stroke(run, label));
    }
    for (int round = 0; round < 3; round++) { // warm-up rounds, then the measured one
      SeedStrokes s = new SeedStrokes(w, h, 1);
      strokes.strokes().forEach(s::add);
      LiveCut live = new LiveCut(features, Neighborhood.of(8));
      live.useModel(ModelLearner.learn(features, s.labels(), ModelKind.AUTO));
      live.update(s.labels(), 2.0, Double.NaN);
      double[] ms = new double[p.objectCount()];
      int n = 0;
      byte[] seeds = perObject.labels();
      for (int object = 1; object <= p.objectCount(); object++) {
        int[] run = longestRunOf(seeds, p.truthLabels(), w, h, object);
        if (run == null) {
          continue;
        }
        s.add(stroke(run, 1));
        long t0 = System.nanoTime();
        SeedLabels labels = s.labels();
        LiveCut.Outcome o = live.update(labels, 2.0, Double.NaN);
        ByteProcessor bp = new ByteProcessor(w, h, o.mask());
        bp.setThreshold(255, 255, ImageProcessor.NO_LUT_UPDATE);
        new ThresholdToSelection().convert(bp);
        ms[n++] = (System.nanoTime() - t0) / 1e6;
      }
      double[] sorted = Arrays.copyOf(ms, n);
      Arrays.sort(sorted);
      System.out.printf(
          Locale.ROOT,
          "round %d: %d strokes on %dx%d, release to contour ms: median %.1f, quartiles %.1f"
              + " .. %.1f, max %.1f%n",
          round,
          n,
          w,
          h,
          sorted[n / 2],
          sorted[n / 4],
          sorted[3 * n / 4],
          sorted[n - 1]);
    }
  }

  private static SeedStrokes.Stroke stroke(int[] run, int label) {
    return new SeedStrokes.Stroke(
        new float[] {run[0] + 0.5f, run[2] + 0.5f},
        new float[] {run[1] + 0.5f, run[1] + 0.5f},
        3,
        label,
        0);
  }

  private static int[] longestRunOf(byte[] seeds, int[] truth, int w, int h, int object) {
    byte[] only = new byte[seeds.length];
    for (int i = 0; i < seeds.length; i++) {
      if (seeds[i] == 1 && truth[i] == object) {
        only[i] = 1;
      }
    }
    return StrokePlan.longestRun(only, w, h, 1);
  }
}
