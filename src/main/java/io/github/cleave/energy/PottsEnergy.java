package io.github.cleave.energy;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Arrays;
import java.util.Locale;

/**
 * K-class Potts energy on a grid, quantised to integer capacity units:
 *
 * <pre>E(L) = Σ_p D_p(L_p) + Σ_(p,q) B_pq · [L_p ≠ L_q]</pre>
 *
 * over labellings L with {@code L_p ∈ 1..K} (class 1 foreground, 2 background, 3..K further
 * classes, as seed labels number them). {@code B_pq} is exactly the two-class boundary capacity of
 * {@link CutProblem} (boundary penalty, Cauchy–Crofton weights, contrast scale, calibration) and
 * {@code D_p(c)} is the regional cost quantised by {@link CapacityScale#toCapacity}, so every
 * energy is an exact {@code long} sum.
 *
 * <p>Seeds are hard constraints: a seed of label s fixes its voxel to class s; a labelling that
 * breaks one has energy {@link Long#MAX_VALUE}. As in {@link CutProblem}, a seed voxel contributes
 * no regional term (its class is not a choice), so with K = 2 the energy of a labelling equals the
 * capacity of the corresponding cut of {@link CutProblem}.
 *
 * <p>Memory: {@code K} ints per voxel for the regional costs, {@code K_nb / 2} for the pair weights
 * (neighbourhood of {@code K_nb}), one byte for the seeds. Evaluating an energy is O(n · (1 + K_nb
 * / 2)). Immutable after construction; safe to read from several threads.
 */
public final class PottsEnergy {
  private final PottsPairs pairs;
  private final int[][] regional; // regional[c - 1][p] = quantised D_p(c); 0 at seeds
  private final byte[] seeds; // our copy: 0 free, else the fixed class (unsigned)
  private final int hardCapacity; // > any boundary a single voxel's move could save

  private PottsEnergy(PottsPairs pairs, int[][] regional, byte[] seeds) {
    this.pairs = pairs;
    this.regional = regional;
    this.seeds = seeds;
    this.hardCapacity = pairs.largestSum + 1;
  }

  /**
   * Builds the energy.
   *
   * @param features the values the boundary term compares (the driving channels)
   * @param costs {@code costs[c][p] = D_p(class c + 1)} in nats, as {@code LikelihoodModel.costs}
   *     writes them; at least two classes, at most {@value SeedLabels#MAX_CLASS}
   * @param seeds hard constraints: label s fixes the voxel to class s; 0 leaves it free
   * @param parameters boundary penalty, contrast scale, neighbourhood, calibration
   * @throws IllegalArgumentException on a size mismatch, fewer than two or more than 255 classes, a
   *     seed label above the class count, or a neighbourhood that does not fit the image
   */
  public static PottsEnergy build(
      Raster features, float[][] costs, SeedLabels seeds, EnergyParameters parameters) {
    byte[] fixed = checked(features.size(), costs, seeds);
    CutProblem.checkFits(features, parameters.neighborhood());
    return new PottsEnergy(PottsPairs.of(features, parameters), regional(costs, fixed), fixed);
  }

  /**
   * The energy of the same image and boundary term with other regional costs and seeds: the
   * boundary weights are kept, not computed again (they depend on neither).
   *
   * @throws IllegalArgumentException as {@link #build} for the costs and seeds
   */
  public PottsEnergy withCostsAndSeeds(float[][] costs, SeedLabels seeds) {
    byte[] fixed = checked(this.seeds.length, costs, seeds);
    return new PottsEnergy(pairs, regional(costs, fixed), fixed);
  }

  /** Checks costs and seeds for n voxels; returns a copy of the seed labels. */
  private static byte[] checked(int n, float[][] costs, SeedLabels seeds) {
    if (costs.length < 2 || costs.length > SeedLabels.MAX_CLASS) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "Potts energy: %d classes of regional costs; give 2 to %d",
              costs.length,
              SeedLabels.MAX_CLASS));
    }
    for (int c = 0; c < costs.length; c++) {
      if (costs[c].length != n) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "Potts energy: class %d has %d regional costs for %d voxels",
                c + 1,
                costs[c].length,
                n));
      }
    }
    if (seeds.size() != n) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT, "Potts energy: %d seed labels for %d voxels", seeds.size(), n));
    }
    byte[] fixed = seeds.labels().clone();
    for (int p = 0; p < n; p++) {
      if ((fixed[p] & 0xff) > costs.length) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "Potts energy: seed label %d at voxel %d, but only %d classes have costs;"
                    + " give costs for every seeded class",
                fixed[p] & 0xff,
                p,
                costs.length));
      }
    }
    return fixed;
  }

  /** The quantised regional costs, 0 at seeds. */
  private static int[][] regional(float[][] costs, byte[] fixed) {
    int n = fixed.length;
    int[][] regional = new int[costs.length][n];
    for (int c = 0; c < costs.length; c++) {
      float[] from = costs[c];
      int[] to = regional[c];
      for (int p = 0; p < n; p++) {
        to[p] = fixed[p] == 0 ? CapacityScale.toCapacity(from[p]) : 0;
      }
    }
    return regional;
  }

  /** Number of classes K (≥ 2). */
  public int classCount() {
    return regional.length;
  }

  /** Number of voxels. */
  public int size() {
    return seeds.length;
  }

  /**
   * The exact energy of a labelling in capacity units (divide by {@link
   * CapacityScale#UNITS_PER_NAT} for nats), or {@link Long#MAX_VALUE} if it breaks a seed.
   *
   * @param labels {@code labels[p]} in 1..K as an unsigned byte, in the raster's voxel order
   * @throws IllegalArgumentException if the length differs or a label is outside 1..K
   */
  public long energy(byte[] labels) {
    checkLabels(labels);
    long e = 0;
    for (int p = 0; p < labels.length; p++) {
      int label = labels[p] & 0xff;
      int seed = seeds[p] & 0xff;
      if (seed != 0 && seed != label) {
        return Long.MAX_VALUE;
      }
      e += regional[label - 1][p];
    }
    return e + pairs.boundaryEnergy(labels);
  }

  /**
   * The start labelling of an expansion: each voxel's cheapest class (lowest quantised {@code D},
   * ties to the lower class), seeds set to their class. A new array.
   */
  public byte[] cheapestLabels() {
    int n = seeds.length;
    byte[] labels = new byte[n];
    int[] best = regional[0].clone();
    Arrays.fill(labels, (byte) 1);
    for (int c = 1; c < regional.length; c++) {
      int[] d = regional[c];
      byte label = (byte) (c + 1);
      for (int p = 0; p < n; p++) {
        if (d[p] < best[p]) {
          best[p] = d[p];
          labels[p] = label;
        }
      }
    }
    for (int p = 0; p < n; p++) {
      if (seeds[p] != 0) {
        labels[p] = seeds[p];
      }
    }
    return labels;
  }

  /**
   * Throws unless {@code labels} has one label in 1..K per voxel.
   *
   * @throws IllegalArgumentException naming the first offending voxel
   */
  void checkLabels(byte[] labels) {
    if (labels.length != seeds.length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT, "labelling: %d labels for %d voxels", labels.length, seeds.length));
    }
    int classes = regional.length;
    for (int p = 0; p < labels.length; p++) {
      int label = labels[p] & 0xff;
      if (label < 1 || label > classes) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "labelling: label %d at voxel %d; use classes 1 to %d",
                label,
                p,
                classes));
      }
    }
  }

  /** The boundary weights. */
  PottsPairs pairs() {
    return pairs;
  }

  /** {@code regional[c - 1][p]}: quantised {@code D_p(c)}, 0 at seeds; shared, do not modify. */
  int[][] regional() {
    return regional;
  }

  /** The seeds, one unsigned byte per voxel (0 free); shared, do not modify. */
  byte[] seeds() {
    return seeds;
  }

  /**
   * A capacity that no cut can save by moving a single voxel across it: {@code 1 + Σ_k λ · w_k} in
   * capacity units, at least {@code 1 + max_p Σ_q B_pq}, as {@link CutProblem#hardCapacity()}.
   */
  int hardCapacity() {
    return hardCapacity;
  }
}
