package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * A disk of radius r cut with a strong regional term costs its boundary length: with a constant
 * image (every boundary weight {@code λ · w_k}) and λ = 1 the cut cost divided by 2πr stays within
 * the Cauchy–Crofton bounds of ../shared/CHECKS.md: [0.785, 1.111] for 4 neighbours and [0.948,
 * 1.026] for 8 (Boykov and Kolmogorov, ICCV 2003; bounds computed from the weights, CHECKS.md). For
 * 16 neighbours the bounds are computed here the same way, from the cost per unit length of a
 * straight boundary at angle θ, {@code Σ_k w_k |e_k| |sin(θ − φ_k)|} over one direction of each
 * opposite pair; as those bounds are tighter than the staircase of a digitised disk of radius 15 to
 * 60 can follow, 1 % is allowed for digitisation there (our tolerance, no source).
 */
class CauchyCroftonDiskTest {

  @Test
  void diskCutCostIsItsPerimeterWithinTheNeighbourhoodBounds() {
    SplittableRandom random = new SplittableRandom(31L);
    for (Neighborhood nb :
        new Neighborhood[] {Neighborhood.N4, Neighborhood.N8, Neighborhood.N16}) {
      double[] bounds = lineBounds(nb);
      if (nb == Neighborhood.N4) {
        assertThat(bounds[0]).isCloseTo(0.785, org.assertj.core.data.Offset.offset(0.001));
        assertThat(bounds[1]).isCloseTo(1.111, org.assertj.core.data.Offset.offset(0.001));
      } else if (nb == Neighborhood.N8) {
        assertThat(bounds[0]).isCloseTo(0.948, org.assertj.core.data.Offset.offset(0.001));
        assertThat(bounds[1]).isCloseTo(1.026, org.assertj.core.data.Offset.offset(0.001));
      }
      for (int trial = 0; trial < 8; trial++) {
        double r = 15 + random.nextDouble() * 45;
        double cx = 70 + random.nextDouble();
        double cy = 70 + random.nextDouble();
        double ratio = diskCutCost(nb, 140, cx, cy, r) / (2 * Math.PI * r);
        double slack = nb == Neighborhood.N16 ? 0.01 : 0;
        assertThat(ratio).as("%s, r = %.2f", nb, r).isBetween(bounds[0] - slack, bounds[1] + slack);
      }
    }
  }

  /** The cut cost in boundary-length units of a disk forced by its regional term. */
  private static double diskCutCost(Neighborhood nb, int size, double cx, double cy, double r) {
    int n = size * size;
    float[] fg = new float[n];
    float[] bg = new float[n];
    for (int y = 0; y < size; y++) {
      for (int x = 0; x < size; x++) {
        boolean inside = Math.hypot(x - cx, y - cy) <= r;
        fg[x + size * y] = inside ? 0 : 25;
        bg[x + size * y] = inside ? 25 : 0;
      }
    }
    Raster constant = Raster.grey(size, size, 1, new float[n], VoxelSize.PIXELS, PixelKind.FLOAT32);
    CutProblem problem =
        CutProblem.build(
            constant,
            fg,
            bg,
            SeedLabels.empty(size, size, 1),
            new EnergyParameters(1.0, 1.0, nb, VoxelSize.PIXELS),
            true);
    return CapacityScale.toNats(problem.solve().flowValue());
  }

  /** Min and max over θ of the cost per unit length of a straight boundary. */
  private static double[] lineBounds(Neighborhood nb) {
    double[] w = LengthWeights.of(nb);
    double min = Double.MAX_VALUE;
    double max = 0;
    for (int i = 0; i < 36000; i++) {
      double theta = Math.PI * i / 36000;
      double cost = 0;
      for (int k = 0; k < nb.size(); k += 2) {
        double phi = Math.atan2(nb.dy(k), nb.dx(k));
        cost += w[k] * Math.hypot(nb.dx(k), nb.dy(k)) * Math.abs(Math.sin(theta - phi));
      }
      min = Math.min(min, cost);
      max = Math.max(max, cost);
    }
    return new double[] {min, max};
  }
}
