package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import io.github.cleave.flow.Neighborhood;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Cauchy–Crofton weights (Boykov & Kolmogorov, ICCV 2003) checked against the values and bounds in
 * CHECKS.md and against the geometry of digitised lines, disks and balls.
 */
class LengthWeightsTest {

  @Test
  void fourAndEightNeighbourhoodWeightsAreThePublishedOnes() {
    // CHECKS.md (Boykov & Kolmogorov 2003, from memory, medium-high confidence): π/4 for the
    // 4-neighbourhood; π/8 axial and π/(8√2) diagonal for the 8-neighbourhood.
    for (double w : LengthWeights.of(Neighborhood.N4)) {
      assertThat(w).isCloseTo(Math.PI / 4, within(1e-12));
    }
    Neighborhood n8 = Neighborhood.N8;
    double[] w8 = LengthWeights.of(n8);
    for (int k = 0; k < 8; k++) {
      boolean diagonal = n8.dx(k) != 0 && n8.dy(k) != 0;
      assertThat(w8[k])
          .isCloseTo(diagonal ? Math.PI / (8 * Math.sqrt(2)) : Math.PI / 8, within(1e-12));
    }
  }

  @Test
  void sixNeighbourhoodWeightsFollowFromTheFormula() {
    // w = δ³ ΔΦ / (π |e|) with ΔΦ = 4π/6 for six equal face directions: 2/3 (the formula of
    // CHECKS.md evaluated by hand); the numerical solid angles must reproduce it.
    for (double w : LengthWeights.of(Neighborhood.N6)) {
      assertThat(w).isCloseTo(2.0 / 3, within(2e-3));
    }
  }

  /** Bounds of CHECKS.md for the cost of a straight boundary divided by its length. */
  private static double[] lineBounds(Neighborhood nb) {
    return switch (nb) {
      case N4 -> new double[] {0.785, 1.111};
      case N8 -> new double[] {0.948, 1.026};
      default -> new double[] {0.97, 1.03}; // N16: tighter than N8 (our expectation, no source)
    };
  }

  @ParameterizedTest
  @EnumSource(
      value = Neighborhood.class,
      names = {"N4", "N8", "N16"})
  void straightBoundariesCostTheirLengthWithinTheBounds(Neighborhood nb) {
    double[] bounds = lineBounds(nb);
    double[] w = LengthWeights.of(nb);
    SplittableRandom random = new SplittableRandom(11 + nb.ordinal());
    int side = 600;
    for (int trial = 0; trial < 40; trial++) {
      double theta = random.nextDouble() * Math.PI;
      double nx = Math.cos(theta);
      double ny = Math.sin(theta);
      double c = side / 2.0 * (nx + ny) + random.nextDouble() - 0.5;
      // Cut cost of the half-plane n·x < c in the window, counted over arcs inside -> outside,
      // restricted to a central disk so that the window's own border does not count.
      double radius = side * 0.4;
      double cost = 0;
      for (int y = 0; y < side; y++) {
        for (int x = 0; x < side; x++) {
          double cx = x - side / 2.0;
          double cy = y - side / 2.0;
          if (cx * cx + cy * cy > radius * radius || nx * x + ny * y >= c) {
            continue;
          }
          for (int k = 0; k < nb.size(); k++) {
            int qx = x + nb.dx(k);
            int qy = y + nb.dy(k);
            if (nx * qx + ny * qy >= c) {
              cost += w[k];
            }
          }
        }
      }
      double distance = Math.abs(c - side / 2.0 * (nx + ny));
      double chord = 2 * Math.sqrt(radius * radius - distance * distance);
      assertThat(cost / chord)
          .as("%s at %.1f degrees", nb, Math.toDegrees(theta))
          .isBetween(bounds[0] - 0.01, bounds[1] + 0.01);
    }
  }

  @ParameterizedTest
  @EnumSource(
      value = Neighborhood.class,
      names = {"N4", "N8", "N16"})
  void diskCutCostIsItsPerimeterWithinTheBounds(Neighborhood nb) {
    // CHECKS.md: the cut cost of a disk of radius r lies within the line bounds times 2πr.
    double[] bounds = lineBounds(nb);
    double[] w = LengthWeights.of(nb);
    for (double r : new double[] {12.5, 30, 61.3}) {
      double cost = cutCost2d(nb, w, r, 1, 1);
      assertThat(cost / (2 * Math.PI * r)).as("%s r=%s", nb, r).isBetween(bounds[0], bounds[1]);
    }
  }

  @Test
  void anisotropicPixelsMeasurePhysicalPerimeters() {
    // A disk of physical radius 40 on pixels 1 × 2.5 (an ellipse on the pixel grid): with
    // calibrated weights its cut cost is its physical perimeter 2πr within 4 % (our tolerance, no
    // source; Daněk & Matula, VISAPP 2010, analyse the error on anisotropic grids, from memory).
    for (Neighborhood nb : new Neighborhood[] {Neighborhood.N8, Neighborhood.N16}) {
      double[] w = LengthWeights.of(nb, 1, 2.5, 1);
      double cost = cutCost2d(nb, w, 40, 1, 2.5);
      assertThat(cost / (2 * Math.PI * 40)).as("%s", nb).isCloseTo(1, within(0.04));
    }
  }

  @ParameterizedTest
  @EnumSource(
      value = Neighborhood.class,
      names = {"N6", "N18", "N26"})
  void ballCutCostIsItsSurfaceArea(Neighborhood nb) {
    // The weights are unbiased over orientations (Cauchy–Crofton), so a ball's cut cost is close to
    // 4πr²: within 8 % for the 6-neighbourhood and 4 % for the others (our tolerances, no source).
    double tolerance = nb == Neighborhood.N6 ? 0.08 : 0.04;
    for (double[] size : new double[][] {{1, 1, 1}, {1, 1, 2.5}}) {
      double[] w = LengthWeights.of(nb, size[0], size[1], size[2]);
      double r = 14;
      double cost = cutCost3d(nb, w, r, size);
      assertThat(cost / (4 * Math.PI * r * r))
          .as("%s voxel %sx%sx%s", nb, size[0], size[1], size[2])
          .isCloseTo(1, within(tolerance + (size[2] > 1 ? 0.02 : 0)));
    }
  }

  @Test
  void sizesMustBePositiveAndFinite() {
    assertThatThrownBy(() -> LengthWeights.of(Neighborhood.N8, 0, 1, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("positive and finite");
    assertThatThrownBy(() -> LengthWeights.of(Neighborhood.N6, 1, 1, Double.NaN))
        .isInstanceOf(IllegalArgumentException.class);
  }

  /** Cut cost of the disk of physical radius r (centre off the grid points) on sx × sy pixels. */
  private static double cutCost2d(Neighborhood nb, double[] w, double r, double sx, double sy) {
    int nx = (int) Math.ceil(2 * r / sx) + 8;
    int ny = (int) Math.ceil(2 * r / sy) + 8;
    double cx = nx / 2.0 + 0.31;
    double cy = ny / 2.0 + 0.17;
    double cost = 0;
    for (int y = 0; y < ny; y++) {
      for (int x = 0; x < nx; x++) {
        if (!inDisk(x, y, cx, cy, r, sx, sy)) {
          continue;
        }
        for (int k = 0; k < nb.size(); k++) {
          if (!inDisk(x + nb.dx(k), y + nb.dy(k), cx, cy, r, sx, sy)) {
            cost += w[k];
          }
        }
      }
    }
    return cost;
  }

  private static boolean inDisk(
      int x, int y, double cx, double cy, double r, double sx, double sy) {
    double dx = (x - cx) * sx;
    double dy = (y - cy) * sy;
    return dx * dx + dy * dy <= r * r;
  }

  private static double cutCost3d(Neighborhood nb, double[] w, double r, double[] s) {
    int[] n = new int[3];
    double[] c = new double[3];
    double[] offsetInCell = {0.31, 0.17, 0.23};
    for (int i = 0; i < 3; i++) {
      n[i] = (int) Math.ceil(2 * r / s[i]) + 6;
      c[i] = n[i] / 2.0 + offsetInCell[i];
    }
    double cost = 0;
    for (int z = 0; z < n[2]; z++) {
      for (int y = 0; y < n[1]; y++) {
        for (int x = 0; x < n[0]; x++) {
          if (!inBall(x, y, z, c, r, s)) {
            continue;
          }
          for (int k = 0; k < nb.size(); k++) {
            if (!inBall(x + nb.dx(k), y + nb.dy(k), z + nb.dz(k), c, r, s)) {
              cost += w[k];
            }
          }
        }
      }
    }
    return cost;
  }

  private static boolean inBall(int x, int y, int z, double[] c, double r, double[] s) {
    double dx = (x - c[0]) * s[0];
    double dy = (y - c[1]) * s[1];
    double dz = (z - c[2]) * s[2];
    return dx * dx + dy * dy + dz * dz <= r * r;
  }
}
