package io.github.cleave.synth;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.Neighborhood;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * A generated max-flow problem shaped like seeded segmentation of a fluorescence micrograph, for
 * benchmarks, demos and tests. The recipe is fixed so that a (size, neighborhood, flavour, seed)
 * tuple always gives the same capacities:
 *
 * <ol>
 *   <li>Image: a left-to-right illumination ramp {@code 0.25 + 0.25 x / W}, plus bright blobs
 *       (discs or balls, radius 3–8 % of the smallest side, one per 40 000 pixels and at least 3)
 *       adding {@code contrast}, plus Gaussian noise of standard deviation {@code noise}, all drawn
 *       from a {@link SplittableRandom} seeded with {@code seed}.
 *   <li>Terminal costs (Boykov–Jolly style regional term): foreground likelihood Gaussian around
 *       the blob brightness, background around the ramp's mean; {@code cs = Q · (I − μ_b)² / 2s²}
 *       (the cost of calling the pixel background) and {@code ct = Q · (I − μ_f)² / 2s²}, rounded.
 *   <li>Hard seeds: a 3-pixel patch at the centre of every second blob gets {@code cs = seed
 *       capacity}; a patch in each image corner gets {@code ct = seed capacity}.
 *   <li>Neighbour capacities: {@code Q · λ · exp(−ΔI² / 2σ²) / |e_k|}, σ² = ½ · mean ΔI² over the
 *       image (DESIGN.md), symmetric.
 * </ol>
 *
 * The {@link Flavour#ORDINARY} flavour is likelihood-dominated, as interactive segmentation mostly
 * is; {@link Flavour#BOUNDARY_DOMINATED} has neighbour capacities about 20 times the terminal costs
 * and a low contrast, which produces long augmenting paths and many orphans.
 *
 * <p>Arrays are unpadded: node {@code x + W (y + H z)}, arc {@code node * K + k}.
 */
public final class SyntheticGridProblem {

  /** The two kinds of instances. */
  public enum Flavour {
    /** Terminal costs dominate; contrast 0.35, noise 0.08, λ = 0.5. */
    ORDINARY(0.35, 0.08, 0.5),
    /** Neighbour capacities about 20 times the terminal costs; contrast 0.12, noise 0.10. */
    BOUNDARY_DOMINATED(0.12, 0.10, 20.0);

    final double contrast;
    final double noise;
    final double lambda;

    Flavour(double contrast, double noise, double lambda) {
      this.contrast = contrast;
      this.noise = noise;
      this.lambda = lambda;
    }
  }

  /** Quantisation scale from real-valued energy to integer capacity. */
  public static final double QUANTUM = 100.0;

  private final int width;
  private final int height;
  private final int depth;
  private final Neighborhood neighborhood;
  private final int[] sourceCapacity; // cs per node
  private final int[] sinkCapacity; // ct per node
  private final int[] neighborCapacity; // capacity of arc (node, k) at node * K + k, 0 outside

  private SyntheticGridProblem(int width, int height, int depth, Neighborhood neighborhood) {
    this.width = width;
    this.height = height;
    this.depth = depth;
    this.neighborhood = neighborhood;
    int n = width * height * depth;
    this.sourceCapacity = new int[n];
    this.sinkCapacity = new int[n];
    this.neighborCapacity = new int[n * neighborhood.size()];
  }

  /**
   * Generates a problem; {@code depth == 1} for 2D neighbourhoods.
   *
   * @throws IllegalArgumentException for impossible sizes or a neighbourhood of the wrong dimension
   */
  public static SyntheticGridProblem generate(
      int width, int height, int depth, Neighborhood neighborhood, Flavour flavour, long seed) {
    Objects.requireNonNull(flavour);
    if (width < 4
        || height < 4
        || depth < 1
        || (!neighborhood.isThreeDimensional() && depth != 1)) {
      throw new IllegalArgumentException(
          "cannot generate a "
              + width
              + "x"
              + height
              + "x"
              + depth
              + " problem with a "
              + neighborhood
              + "-neighborhood: sides >= 4, depth 1 for 2D neighborhoods");
    }
    SyntheticGridProblem problem = new SyntheticGridProblem(width, height, depth, neighborhood);
    SplittableRandom random = new SplittableRandom(seed);
    float[] image = new float[width * height * depth];
    double[][] blobs = placeBlobs(width, height, depth, random);
    paintImage(image, width, height, depth, blobs, flavour, random);
    problem.setTerminals(image, flavour);
    problem.setSeeds(blobs);
    problem.setNeighbors(image, flavour);
    return problem;
  }

  private static double[][] placeBlobs(int w, int h, int d, SplittableRandom random) {
    int count = Math.max(3, (int) ((long) w * h * d / 40_000));
    int side = Math.min(w, Math.min(h, d == 1 ? Integer.MAX_VALUE : d));
    double[][] blobs = new double[count][];
    for (int i = 0; i < count; i++) {
      double r = side * (0.03 + 0.05 * random.nextDouble()) + 1.5;
      blobs[i] =
          new double[] {
            random.nextDouble() * w,
            random.nextDouble() * h,
            d == 1 ? 0 : random.nextDouble() * d,
            r
          };
    }
    return blobs;
  }

  private static void paintImage(
      float[] image,
      int w,
      int h,
      int d,
      double[][] blobs,
      Flavour flavour,
      SplittableRandom random) {
    for (int z = 0, i = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++, i++) {
          image[i] = (float) (0.25 + 0.25 * x / w + flavour.noise * gaussian(random));
        }
      }
    }
    for (double[] b : blobs) {
      int r = (int) Math.ceil(b[3]);
      for (int z = Math.max(0, (int) b[2] - r); z <= Math.min(d - 1, (int) b[2] + r); z++) {
        for (int y = Math.max(0, (int) b[1] - r); y <= Math.min(h - 1, (int) b[1] + r); y++) {
          for (int x = Math.max(0, (int) b[0] - r); x <= Math.min(w - 1, (int) b[0] + r); x++) {
            double dx = x - b[0];
            double dy = y - b[1];
            double dz = d == 1 ? 0 : z - b[2];
            if (dx * dx + dy * dy + dz * dz <= b[3] * b[3]) {
              image[x + w * (y + h * z)] += (float) flavour.contrast;
            }
          }
        }
      }
    }
  }

  private static double gaussian(SplittableRandom random) {
    // Box-Muller; SplittableRandom has no nextGaussian on Java 17.
    double u = 1.0 - random.nextDouble();
    double v = random.nextDouble();
    return Math.sqrt(-2.0 * Math.log(u)) * Math.cos(2.0 * Math.PI * v);
  }

  private void setTerminals(float[] image, Flavour flavour) {
    double muBackground = 0.375;
    double muForeground = muBackground + flavour.contrast;
    double s = Math.max(flavour.noise, 0.05) * 1.5;
    for (int i = 0; i < image.length; i++) {
      double db = (image[i] - muBackground) / s;
      double df = (image[i] - muForeground) / s;
      sourceCapacity[i] = quantise(0.5 * db * db);
      sinkCapacity[i] = quantise(0.5 * df * df);
    }
  }

  private void setSeeds(double[][] blobs) {
    int seedCapacity = 1 << 20;
    for (int i = 0; i < blobs.length; i += 2) {
      patch((int) blobs[i][0], (int) blobs[i][1], (int) blobs[i][2], seedCapacity, true);
    }
    int z = depth / 2;
    patch(1, 1, z, seedCapacity, false);
    patch(width - 2, 1, z, seedCapacity, false);
    patch(1, height - 2, z, seedCapacity, false);
    patch(width - 2, height - 2, z, seedCapacity, false);
  }

  private void patch(int cx, int cy, int cz, int cap, boolean foreground) {
    for (int z = Math.max(0, cz - 1); z <= Math.min(depth - 1, cz + 1); z++) {
      for (int y = Math.max(0, cy - 1); y <= Math.min(height - 1, cy + 1); y++) {
        for (int x = Math.max(0, cx - 1); x <= Math.min(width - 1, cx + 1); x++) {
          int i = x + width * (y + height * z);
          if (foreground) {
            sourceCapacity[i] = cap;
            sinkCapacity[i] = 0;
          } else {
            sourceCapacity[i] = 0;
            sinkCapacity[i] = cap;
          }
        }
      }
    }
  }

  private void setNeighbors(float[] image, Flavour flavour) {
    int k = neighborhood.size();
    double sum = 0;
    long pairs = 0;
    for (int z = 0, i = 0; z < depth; z++) {
      for (int y = 0; y < height; y++) {
        for (int x = 0; x < width; x++, i++) {
          for (int dir = 0; dir < k; dir += 2) {
            int j = neighbor(x, y, z, dir);
            if (j >= 0) {
              double diff = image[i] - image[j];
              sum += diff * diff;
              pairs++;
            }
          }
        }
      }
    }
    double twoSigmaSquared = Math.max(sum / Math.max(pairs, 1), 1e-12);
    for (int z = 0, i = 0; z < depth; z++) {
      for (int y = 0; y < height; y++) {
        for (int x = 0; x < width; x++, i++) {
          for (int dir = 0; dir < k; dir++) {
            int j = neighbor(x, y, z, dir);
            if (j >= 0) {
              double diff = image[i] - image[j];
              double weight =
                  flavour.lambda
                      * Math.exp(-diff * diff / twoSigmaSquared)
                      / neighborhood.length(dir);
              neighborCapacity[i * k + dir] = quantise(weight);
            }
          }
        }
      }
    }
  }

  private int neighbor(int x, int y, int z, int dir) {
    int nx = x + neighborhood.dx(dir);
    int ny = y + neighborhood.dy(dir);
    int nz = z + neighborhood.dz(dir);
    if (nx < 0 || nx >= width || ny < 0 || ny >= height || nz < 0 || nz >= depth) {
      return -1;
    }
    return nx + width * (ny + height * nz);
  }

  private static int quantise(double energy) {
    return (int) Math.min(Math.round(energy * QUANTUM), 1 << 20);
  }

  /** Grid width. */
  public int width() {
    return width;
  }

  /** Grid height. */
  public int height() {
    return height;
  }

  /** Grid depth (1 in 2D). */
  public int depth() {
    return depth;
  }

  /** The neighbourhood. */
  public Neighborhood neighborhood() {
    return neighborhood;
  }

  /** Number of pixel nodes. */
  public int nodeCount() {
    return sourceCapacity.length;
  }

  /** Capacity from the source to {@code node}. */
  public int sourceCapacity(int node) {
    return sourceCapacity[node];
  }

  /** Capacity from {@code node} to the sink. */
  public int sinkCapacity(int node) {
    return sinkCapacity[node];
  }

  /**
   * Capacity of the arc from {@code node} in direction {@code k}; 0 if the neighbour is outside.
   */
  public int neighborCapacity(int node, int k) {
    return neighborCapacity[node * neighborhood.size() + k];
  }

  /** Number of arcs with positive capacity, terminal arcs included. */
  public long arcCount() {
    long arcs = 0;
    for (int i = 0; i < sourceCapacity.length; i++) {
      arcs += (sourceCapacity[i] > 0 ? 1 : 0) + (sinkCapacity[i] > 0 ? 1 : 0);
    }
    for (int c : neighborCapacity) {
      arcs += c > 0 ? 1 : 0;
    }
    return arcs;
  }

  /**
   * A copy with every capacity multiplied by {@code factor} (so with the same minimum cut and
   * {@code factor} times the flow), saturating at {@code Integer.MAX_VALUE / 2}; benchmarks use it
   * to exercise 32-bit residuals on the same instance.
   *
   * @throws IllegalArgumentException if {@code factor < 1}
   */
  public SyntheticGridProblem scaled(int factor) {
    if (factor < 1) {
      throw new IllegalArgumentException("scale factor " + factor + "; it must be at least 1");
    }
    SyntheticGridProblem copy = new SyntheticGridProblem(width, height, depth, neighborhood);
    scale(sourceCapacity, copy.sourceCapacity, factor);
    scale(sinkCapacity, copy.sinkCapacity, factor);
    scale(neighborCapacity, copy.neighborCapacity, factor);
    return copy;
  }

  private static void scale(int[] from, int[] to, int factor) {
    for (int i = 0; i < from.length; i++) {
      to[i] = (int) Math.min((long) from[i] * factor, Integer.MAX_VALUE / 2);
    }
  }

  /** A new solver holding this problem's capacities (built with the bulk setters). */
  public GridMaxFlow toSolver(boolean retainCapacities) {
    GridMaxFlow solver = new GridMaxFlow(width, height, depth, neighborhood, retainCapacities);
    solver.setTerminalCapacities(sourceCapacity, sinkCapacity);
    solver.setNeighborCapacities(neighborCapacity);
    return solver;
  }
}
