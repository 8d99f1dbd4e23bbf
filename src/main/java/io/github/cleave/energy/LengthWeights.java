package io.github.cleave.energy;

import io.github.cleave.flow.Neighborhood;
import java.util.Arrays;

/**
 * Cauchy–Crofton length weights of a grid neighbourhood: the weight {@code w_k} of neighbour
 * direction {@code k} such that the cut cost {@code Σ w_k} over the arcs a boundary crosses
 * approximates the boundary's Euclidean length (2D) or area (3D), in calibrated units.
 *
 * <p>Y. Boykov and V. Kolmogorov, "Computing geodesics and minimal surfaces via graph cuts", ICCV
 * 2003, doi:10.1109/ICCV.2003.1238310: in 2D {@code w_k = δ² Δφ_k / (2 |e_k|)}, in 3D {@code w_k =
 * δ³ ΔΦ_k / (π |e_k|)}, with {@code |e_k|} the length of the direction vector, {@code δ²} the area
 * of a pixel and {@code δ³} the volume of a voxel, {@code Δφ_k} the angle and {@code ΔΦ_k} the
 * solid angle of the directions closer to {@code e_k} (or to {@code −e_k}) than to any other
 * neighbourhood direction. A direction and its opposite are the same family of lines, so the
 * partition is of the half-turn in 2D and of the hemisphere in 3D.
 *
 * <p>With anisotropic pixel or voxel sizes the direction vectors, their lengths and the angles are
 * those of the calibrated vectors {@code (sx·dx, sy·dy, sz·dz)}, which keeps the weights consistent
 * with the physical geometry (the principle of Daněk and Matula, VISAPP 2010).
 *
 * <p>The 2D angles are exact (sorted directions; each direction owns the angle between the
 * bisectors of its two neighbours, which is the spacing itself for the 4- and 8-neighbourhoods).
 * The 3D solid angles are integrated numerically over a deterministic Fibonacci lattice of {@value
 * #SPHERE_SAMPLES} directions (relative error about 10⁻³), so the same calibration always gives the
 * same weights.
 */
public final class LengthWeights {
  /** Directions sampled on the hemisphere for the 3D solid angles. */
  static final int SPHERE_SAMPLES = 200_000;

  private LengthWeights() {}

  /**
   * The weights for {@code nb}, indexed like its directions, for pixels or voxels of size {@code sx
   * × sy × sz} (any unit; {@code sz} is ignored in 2D).
   *
   * @throws IllegalArgumentException if a size is not positive and finite
   */
  public static double[] of(Neighborhood nb, double sx, double sy, double sz) {
    for (double s : new double[] {sx, sy, nb.isThreeDimensional() ? sz : 1}) {
      if (!(s > 0) || Double.isInfinite(s)) {
        throw new IllegalArgumentException(
            "pixel size " + s + ": pixel and voxel sizes must be positive and finite");
      }
    }
    return nb.isThreeDimensional() ? weights3d(nb, sx, sy, sz) : weights2d(nb, sx, sy);
  }

  /** The weights for square pixels or cubic voxels of side 1. */
  public static double[] of(Neighborhood nb) {
    return of(nb, 1, 1, 1);
  }

  private static double[] weights2d(Neighborhood nb, double sx, double sy) {
    int n = nb.size();
    double[] angle = new double[n];
    double[] length = new double[n];
    for (int k = 0; k < n; k++) {
      double vx = sx * nb.dx(k);
      double vy = sy * nb.dy(k);
      length[k] = Math.hypot(vx, vy);
      if (vy < 0 || (vy == 0 && vx < 0)) {
        vx = -vx; // a direction and its opposite give the same line family, bit for bit
        vy = -vy;
      }
      angle[k] = Math.atan2(vy, vx) + 0.0; // in [0, π); + 0.0 turns -0.0 into 0.0
    }
    // Each line family appears twice (k and its opposite); sort the distinct families.
    double[] families = Arrays.stream(angle).distinct().sorted().toArray();
    int m = families.length;
    double[] weights = new double[n];
    for (int k = 0; k < n; k++) {
      int i = Arrays.binarySearch(families, angle[k]);
      double previous = i > 0 ? families[i - 1] : families[m - 1] - Math.PI;
      double next = i < m - 1 ? families[i + 1] : families[0] + Math.PI;
      double share = (next - previous) / 2; // between the bisectors
      weights[k] = sx * sy * share / (2 * length[k]);
    }
    return weights;
  }

  private static double[] weights3d(Neighborhood nb, double sx, double sy, double sz) {
    int n = nb.size();
    double[][] unit = new double[n][];
    double[] length = new double[n];
    for (int k = 0; k < n; k++) {
      double vx = sx * nb.dx(k);
      double vy = sy * nb.dy(k);
      double vz = sz * nb.dz(k);
      length[k] = Math.sqrt(vx * vx + vy * vy + vz * vz);
      unit[k] = new double[] {vx / length[k], vy / length[k], vz / length[k]};
    }
    // Solid angle owned by each line family: sample the hemisphere z >= 0 evenly (Fibonacci
    // lattice) and give each sample to the family whose line is closest in angle (|cos| largest).
    long[] count = new long[n];
    double golden = Math.PI * (3 - Math.sqrt(5));
    for (int i = 0; i < SPHERE_SAMPLES; i++) {
      double z = (i + 0.5) / SPHERE_SAMPLES; // uniform in z gives uniform area on the sphere
      double r = Math.sqrt(1 - z * z);
      double phi = golden * i;
      double x = r * Math.cos(phi);
      double y = r * Math.sin(phi);
      int best = 0;
      double bestCos = -1;
      for (int k = 0; k < n; k++) {
        double c = Math.abs(unit[k][0] * x + unit[k][1] * y + unit[k][2] * z);
        if (c > bestCos + 1e-12) {
          bestCos = c;
          best = k;
        }
      }
      count[best]++;
    }
    // On the whole sphere each of the two opposite directions owns the family's hemisphere share.
    double[] weights = new double[n];
    for (int k = 0; k < n; k++) {
      int opposite = Neighborhood.opposite(k);
      double solid = 2 * Math.PI * (count[k] + count[opposite]) / SPHERE_SAMPLES;
      weights[k] = sx * sy * sz * solid / (Math.PI * length[k]);
    }
    return weights;
  }
}
