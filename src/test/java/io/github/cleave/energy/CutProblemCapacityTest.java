package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.offset;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The table-driven build of {@link CutProblem} gives exactly the capacities of the straightforward
 * computation (one exponential per neighbour pair, as the class comment of {@link BoundaryArcs}
 * states the formula), on random images of every pixel kind and every neighbourhood, whichever
 * evaluation path the image and the table budget select. The reference below is the code the tables
 * replaced, kept here unchanged.
 */
class CutProblemCapacityTest {
  private static final int[] PLANE = {4, 8, 16};
  private static final int[] VOLUME = {6, 18, 26};

  @Test
  void capacitiesEqualTheDirectFormulaOnRandomImages() {
    checkRandomImages(new SplittableRandom(20261203L), 120, 8, 3);
  }

  @Test
  void capacitiesEqualTheDirectFormulaOnTinyImages() { // narrower than the neighbourhood's reach
    checkRandomImages(new SplittableRandom(5L), 120, 1, 2);
  }

  private static void checkRandomImages(
      SplittableRandom random, int trials, int smallest, int fewestPlanes) {
    for (int trial = 0; trial < trials; trial++) {
      boolean volume = random.nextInt(3) == 0;
      int w = smallest + random.nextInt(smallest == 1 ? 5 : 40);
      int h = smallest + random.nextInt(smallest == 1 ? 5 : 30);
      int d = volume ? fewestPlanes + random.nextInt(5) : 1;
      Neighborhood nb =
          Neighborhood.of(volume ? VOLUME[random.nextInt(3)] : PLANE[random.nextInt(3)]);
      Raster image = randomImage(random, w, h, d, trial % 6);
      // the estimate sums in another order than the reference: equal up to rounding
      double sigmaReference = referenceSigma(image, nb);
      assertThat(ContrastScale.estimate(image, nb))
          .isCloseTo(sigmaReference, offset(1e-12 * sigmaReference));
      double sigma =
          random.nextBoolean()
              ? ContrastScale.estimate(image, nb)
              : Math.pow(10, random.nextDouble() * 4 - 1);
      VoxelSize size =
          new VoxelSize(1, 0.5 + random.nextDouble(), 0.5 + 3 * random.nextDouble(), "um", false);
      double lambda = random.nextInt(8) == 0 ? 0 : random.nextDouble() * 30;
      EnergyParameters parameters = new EnergyParameters(lambda, sigma, nb, size);
      int[] reference = referenceCapacities(image, parameters);
      int hard = hardCapacity(parameters);
      // K must exceed the boundary around any voxel (Boykov and Jolly, ICCV 2001)
      assertThat(hard).isGreaterThan(largestSum(reference, image.size(), nb.size()));
      for (int budget : new int[] {0, 50, image.size() / 4, Integer.MAX_VALUE}) {
        GridMaxFlow solver = new GridMaxFlow(w, h, d, nb, true);
        int largest = BoundaryArcs.set(solver, image, parameters, budget);
        assertThat(largest + 1).as("trial %d, budget %d", trial, budget).isEqualTo(hard);
        assertSameArcs(solver, reference, trial, budget);
      }
      float[] fg = new float[image.size()];
      float[] bg = new float[image.size()];
      byte[] labels = new byte[image.size()];
      for (int p = 0; p < fg.length; p++) {
        fg[p] = (float) (random.nextDouble() * 10);
        bg[p] = (float) (random.nextDouble() * 10);
        labels[p] = (byte) random.nextInt(3);
      }
      CutProblem problem =
          CutProblem.build(image, fg, bg, new SeedLabels(w, h, d, labels), parameters, true);
      assertThat(problem.hardCapacity()).isEqualTo(hard);
      assertSameArcs(problem.solver(), reference, trial, -1);
      for (int p = 0; p < fg.length; p++) {
        int source = labels[p] == 1 ? hard : labels[p] == 2 ? 0 : CapacityScale.toCapacity(bg[p]);
        int sink = labels[p] == 2 ? hard : labels[p] == 1 ? 0 : CapacityScale.toCapacity(fg[p]);
        assertThat(problem.solver().sourceCapacity(p)).isEqualTo(source);
        assertThat(problem.solver().sinkCapacity(p)).isEqualTo(sink);
      }
    }
  }

  @Test
  void stepFunctionEqualsTheFormulaAtAndAroundEveryStep() {
    SplittableRandom random = new SplittableRandom(11L);
    for (int trial = 0; trial < 40; trial++) {
      double scale = trial == 0 ? 0 : Math.pow(10, random.nextDouble() * 4 - 1);
      ExponentialSteps steps = ExponentialSteps.of(scale, ExponentialSteps.MAX_STEPS);
      int m = BoundaryArcs.capacity(scale, 0);
      for (int j = 1; j <= m + 1; j++) {
        double around = Math.log(scale / (j - 0.5));
        double x = Math.max(0, around);
        for (int u = 0; u < 8; u++) {
          x = Math.nextDown(x);
        }
        for (int u = 0; u < 16; u++, x = Math.nextUp(x)) {
          if (x >= 0) {
            assertThat(steps.capacity(x))
                .as("scale %s, x %s", scale, x)
                .isEqualTo(BoundaryArcs.capacity(scale, x));
          }
        }
      }
      for (int i = 0; i < 2000; i++) {
        double x = random.nextDouble() * 20;
        assertThat(steps.capacity(x)).isEqualTo(BoundaryArcs.capacity(scale, x));
      }
      for (double x : new double[] {0, Double.MIN_VALUE, 800, Double.POSITIVE_INFINITY}) {
        assertThat(steps.capacity(x)).isEqualTo(BoundaryArcs.capacity(scale, x));
      }
      assertThat(steps.capacity(Double.NaN)).isZero();
    }
  }

  /**
   * Kinds: 0 8-bit, 1 16-bit, 2 float with a few non-finite values, 3 three 8-bit channels, 4 two
   * float channels, 5 16-bit with a narrow range (most pairs within the table).
   */
  private static Raster randomImage(SplittableRandom random, int w, int h, int d, int kind) {
    int n = w * h * d;
    int channels = kind == 3 ? 3 : kind == 4 ? 2 : 1;
    float[][] values = new float[channels][n];
    for (float[] v : values) {
      for (int p = 0; p < n; p++) {
        v[p] =
            switch (kind) {
              case 0, 3 -> random.nextInt(256);
              case 1 -> random.nextInt(65536);
              case 5 -> 1000 + random.nextInt(40);
              default -> (float) (random.nextGaussian() * 50);
            };
      }
      if (kind == 2 || kind == 4) {
        v[random.nextInt(n)] = Float.NaN;
        v[random.nextInt(n)] = Float.POSITIVE_INFINITY;
      }
    }
    PixelKind pixelKind =
        kind == 0 || kind == 3
            ? PixelKind.GREY8
            : kind == 1 || kind == 5 ? PixelKind.GREY16 : PixelKind.FLOAT32;
    return new Raster(w, h, d, values, new VoxelSize(1, 1, 1, "um", false), pixelKind);
  }

  private static void assertSameArcs(GridMaxFlow solver, int[] reference, int trial, int budget) {
    int directions = solver.neighborhood().size();
    for (int p = 0; p < solver.nodeCount(); p++) {
      for (int k = 0; k < directions; k++) {
        if (solver.neighbor(p, k) >= 0) {
          assertThat(solver.neighborCapacity(p, k))
              .as("trial %d, budget %d, node %d, direction %d", trial, budget, p, k)
              .isEqualTo(reference[p * directions + k]);
        }
      }
    }
  }

  /** The contrast scale as first written: one squared difference per pair, same order. */
  private static double referenceSigma(Raster features, Neighborhood nb) {
    int w = features.width();
    int h = features.height();
    int d = features.depth();
    double sum = 0;
    long pairs = 0;
    for (int k = 0; k < nb.size(); k += 2) {
      int dx = nb.dx(k);
      int dy = nb.dy(k);
      int dz = nb.dz(k);
      int step = dx + w * (dy + h * dz);
      for (int z = Math.max(0, -dz); z < Math.min(d, d - dz); z++) {
        for (int y = Math.max(0, -dy); y < Math.min(h, h - dy); y++) {
          for (int x = Math.max(0, -dx); x < Math.min(w, w - dx); x++) {
            int p = x + w * (y + h * z);
            double sq = ContrastScale.squaredDifference(features, p, p + step);
            if (Double.isFinite(sq)) {
              sum += sq;
              pairs++;
            }
          }
        }
      }
    }
    double mean = pairs == 0 ? 0 : sum / pairs;
    double sigma = Math.sqrt(0.5 * mean);
    return sigma > 0 ? sigma : Double.MIN_NORMAL;
  }

  /**
   * {@code 1 + Σ_k λ · w_k} in capacity units, each weight rounded as the formula rounds it: the
   * boundary around a voxel whose neighbours all equal it.
   */
  private static int hardCapacity(EnergyParameters parameters) {
    int hard = 1;
    for (double w : parameters.lengthWeights()) {
      hard +=
          BoundaryArcs.capacity(parameters.boundaryPenalty() * w * CapacityScale.UNITS_PER_NAT, 0);
    }
    return hard;
  }

  /** The largest sum of the capacities of the arcs leaving one voxel. */
  private static int largestSum(int[] caps, int n, int directions) {
    int largest = 0;
    for (int p = 0; p < n; p++) {
      int sum = 0;
      for (int k = 0; k < directions; k++) {
        sum += caps[p * directions + k];
      }
      largest = Math.max(largest, sum);
    }
    return largest;
  }

  /** The straightforward computation: one exponential per unordered pair, interleaved result. */
  private static int[] referenceCapacities(Raster features, EnergyParameters parameters) {
    Neighborhood nb = parameters.neighborhood();
    double[] lengthWeight = parameters.lengthWeights();
    double sigma = parameters.contrastScale();
    double inverseTwoSigmaSquared = 1.0 / (2 * sigma * sigma);
    int w = features.width();
    int h = features.height();
    int d = features.depth();
    int directions = nb.size();
    int[] caps = new int[features.size() * directions];
    for (int k = 0; k < directions; k += 2) {
      int dx = nb.dx(k);
      int dy = nb.dy(k);
      int dz = nb.dz(k);
      int step = dx + w * (dy + h * dz);
      double scale = parameters.boundaryPenalty() * lengthWeight[k] * CapacityScale.UNITS_PER_NAT;
      for (int z = Math.max(0, -dz); z < Math.min(d, d - dz); z++) {
        for (int y = Math.max(0, -dy); y < Math.min(h, h - dy); y++) {
          for (int x = Math.max(0, -dx); x < Math.min(w, w - dx); x++) {
            int p = x + w * (y + h * z);
            double sq = ContrastScale.squaredDifference(features, p, p + step);
            double value = scale * Math.exp(-(sq * inverseTwoSigmaSquared));
            int cap = value >= 0 ? (int) Math.min(Integer.MAX_VALUE / 64, Math.rint(value)) : 0;
            caps[p * directions + k] = cap;
            caps[(p + step) * directions + (k ^ 1)] = cap;
          }
        }
      }
    }
    return caps;
  }
}
