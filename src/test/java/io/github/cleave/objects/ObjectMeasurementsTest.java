package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ObjectMeasurementsTest {

  private static ObjectMeasurement only(byte[] mask, int w, int h, int d, VoxelSize vs) {
    List<ObjectMeasurement> all =
        ObjectMeasurements.measure(ConnectedComponents.of(mask, w, h, d), vs);
    assertThat(all).hasSize(1);
    return all.get(0);
  }

  @Test
  void diskAreaAndPerimeterInCalibratedUnits() {
    SplittableRandom rnd = new SplittableRandom(21);
    for (int t = 0; t < 40; t++) {
      double sx = rnd.nextDouble(0.2, 2);
      double sy = sx * rnd.nextDouble(0.6, 1.6);
      double r = Math.max(sx, sy) * rnd.nextDouble(8, 60); // at least 8 pixels
      int w = (int) Math.ceil(2 * r / sx) + 8;
      int h = (int) Math.ceil(2 * r / sy) + 8;
      double cx = w * sx / 2 + rnd.nextDouble(-2, 2) * sx;
      double cy = h * sy / 2 + rnd.nextDouble(-2, 2) * sy;
      byte[] mask = new byte[w * h];
      Phantoms.disk(mask, w, h, sx, sy, cx, cy, r);
      ObjectMeasurement m = only(mask, w, h, 1, new VoxelSize(sx, sy, 1, "um", false));

      // Gauss's circle argument (Hardy & Wright, An Introduction to the Theory of Numbers, §18.7;
      // from memory): the cells whose centres lie in the disk cover the disk of radius r - rho and
      // lie inside the disk of radius r + rho, rho = half the cell diagonal, so the area error is
      // at most pi((r + rho)^2 - r^2) = O(r).
      double rho = 0.5 * Math.hypot(sx, sy);
      double area = Math.PI * r * r;
      assertThat(m.areaOrVolume()).isCloseTo(area, within(Math.PI * (2 * r * rho + rho * rho)));
      assertThat(m.voxelCount() * sx * sy).isCloseTo(m.areaOrVolume(), within(1e-9 * area));
      assertThat(m.centroidX()).isCloseTo(cx, within(rho));
      assertThat(m.centroidY()).isCloseTo(cy, within(rho));
      assertThat(m.centroidZ()).isZero();

      // CHECKS.md: a Cauchy-Crofton estimate with 8-neighbour weights stays within [0.948, 1.026]
      // of the Euclidean length (Boykov & Kolmogorov, ICCV 2003); we use the finer
      // 16-neighbourhood.
      double ratio = m.perimeterOrSurface() / (2 * Math.PI * r);
      assertThat(ratio).as("disk r=%s, pixel %s x %s", r, sx, sy).isBetween(0.948, 1.026);
      // Tighter: every lattice line of a direction family meets a digital disk in one run of
      // pixels and so crosses its boundary exactly twice; the estimate is exact up to the count of
      // such lines, an error of a few lines per family, i.e. O(1) pixel lengths, not O(r)
      // (derived here from the Cauchy-Crofton formula; no published bound at hand).
      assertThat(m.perimeterOrSurface()).isCloseTo(2 * Math.PI * r, within(2 * Math.max(sx, sy)));
    }
  }

  @Test
  void ellipseArea() {
    SplittableRandom rnd = new SplittableRandom(22);
    for (int t = 0; t < 20; t++) {
      double s = rnd.nextDouble(0.3, 1.5);
      double a = s * rnd.nextDouble(6, 50);
      double b = s * rnd.nextDouble(6, 50);
      int w = (int) Math.ceil(2 * a / s) + 6;
      int h = (int) Math.ceil(2 * b / s) + 6;
      byte[] mask = new byte[w * h];
      Phantoms.ellipse(mask, w, h, s, s, w * s / 2, h * s / 2, a, b);
      ObjectMeasurement m = only(mask, w, h, 1, new VoxelSize(s, s, 1, "mm", false));
      // Area pi a b (analytic). Error bound as for the disk, with the Steiner-type bounds
      // |A(E +- rho B) - A(E)| <= rho P(E) + pi rho^2 (Steiner formula, from memory) and
      // P(E) <= 2 pi max(a, b) (a convex set inside another has the smaller perimeter).
      double rho = s * Math.sqrt(0.5);
      double tol = rho * 2 * Math.PI * Math.max(a, b) + Math.PI * rho * rho;
      assertThat(m.areaOrVolume()).isCloseTo(Math.PI * a * b, within(tol));
    }
  }

  @Test
  void ballVolumeAndSurfaceWithAnisotropicVoxels() {
    SplittableRandom rnd = new SplittableRandom(23);
    for (int t = 0; t < 8; t++) {
      double sx = rnd.nextDouble(0.3, 0.6);
      double sy = sx;
      double sz = sx * rnd.nextDouble(2, 3); // z step 2-3 times the pixel size
      double r = sz * rnd.nextDouble(3, 6);
      int w = (int) Math.ceil(2 * r / sx) + 4;
      int h = w;
      int d = (int) Math.ceil(2 * r / sz) + 4;
      byte[] mask = new byte[w * h * d];
      double cx = w * sx / 2 + rnd.nextDouble(-1, 1) * sx;
      double cy = h * sy / 2 + rnd.nextDouble(-1, 1) * sy;
      double cz = d * sz / 2 + rnd.nextDouble(-1, 1) * sz;
      Phantoms.ball(mask, w, h, d, sx, sy, sz, cx, cy, cz, r);
      ObjectMeasurement m = only(mask, w, h, d, new VoxelSize(sx, sy, sz, "um", false));
      // Volume 4/3 pi r^3 (analytic); the cell-cover argument of the disk test in 3D bounds the
      // error by 4/3 pi ((r + rho)^3 - r^3), rho = half the voxel diagonal.
      double rho = 0.5 * Math.sqrt(sx * sx + sy * sy + sz * sz);
      double volume = 4.0 / 3 * Math.PI * r * r * r;
      assertThat(m.areaOrVolume())
          .isCloseTo(volume, within(4.0 / 3 * Math.PI * (Math.pow(r + rho, 3) - r * r * r)));
      assertThat(m.centroidZ()).isCloseTo(cz, within(rho));
      assertThat(m.boxDepth()).isBetween((int) (2 * r / sz) - 1, (int) (2 * r / sz) + 2);
      // Surface 4 pi r^2 (analytic), Cauchy-Crofton with calibrated 26-neighbour weights (Boykov &
      // Kolmogorov, ICCV 2003). Each lattice line crosses a digital ball's boundary twice, so the
      // error is that of counting lattice lines over the ball's shadow, relative O(spacing / r),
      // plus about 1e-3 from the numerically integrated solid angles; 4 % at r >= 3 planes (our
      // own tolerance, from the observed errors of about 1-2 %).
      assertThat(m.perimeterOrSurface() / (4 * Math.PI * r * r))
          .as("ball r=%s, voxel %s x %s x %s", r, sx, sy, sz)
          .isCloseTo(1.0, within(0.04));
    }
  }

  @Test
  void intensitiesOnConstructedImage() {
    // Two objects on a 4 x 3 image; values chosen by hand.
    int[] labels = {
      1, 1, 0, 2,
      1, 0, 0, 2,
      0, 0, 0, 2
    };
    float[] grey = {
      10, 20, 99, 1,
      30, 99, 99, 2,
      99, 99, 99, 6
    };
    float[] other = new float[12];
    for (int i = 0; i < 12; i++) {
      other[i] = -i;
    }
    VoxelSize vs = new VoxelSize(0.5, 2, 1, "um", false); // pixel area 1 um^2
    Raster image = new Raster(4, 3, 1, new float[][] {grey, other}, vs, PixelKind.FLOAT32);
    List<ObjectMeasurement> ms =
        ObjectMeasurements.measure(
            ObjectLabels.renumbered(4, 3, 1, labels), vs, image, new int[] {1, 0});
    ObjectMeasurement a = ms.get(0);
    ObjectMeasurement b = ms.get(1);
    assertThat(a.label()).isEqualTo(1);
    assertThat(a.voxelCount()).isEqualTo(3);
    assertThat(a.areaOrVolume()).isEqualTo(3.0);
    ChannelStatistics ag = a.channels().get(1);
    assertThat(ag.channel()).isZero();
    assertThat(ag.mean()).isEqualTo(20.0);
    assertThat(ag.min()).isEqualTo(10.0);
    assertThat(ag.max()).isEqualTo(30.0);
    assertThat(ag.rawIntegratedDensity()).isEqualTo(60.0);
    assertThat(ag.integratedDensity()).isEqualTo(60.0 * 0.5 * 2); // mean x area
    ChannelStatistics ao = a.channels().get(0);
    assertThat(ao.channel()).isEqualTo(1);
    assertThat(ao.rawIntegratedDensity()).isEqualTo(-(0 + 1 + 4));
    assertThat(ao.min()).isEqualTo(-4.0);
    assertThat(ao.max()).isEqualTo(0.0);
    ChannelStatistics bg = b.channels().get(1);
    assertThat(bg.mean()).isEqualTo(3.0);
    assertThat(bg.rawIntegratedDensity()).isEqualTo(9.0);
    assertThat(b.boxX()).isEqualTo(3);
    assertThat(b.boxY()).isZero();
    assertThat(b.boxWidth()).isEqualTo(1);
    assertThat(b.boxHeight()).isEqualTo(3);
    assertThat(b.centroidX()).isEqualTo(3.5 * 0.5);
    assertThat(b.centroidY()).isEqualTo(1.5 * 2);
  }

  @Test
  void stackIntegratedDensityUsesVoxelVolume() {
    int[] labels = {1, 0, 1, 1}; // 1 x 2 x 2
    float[] v = {2, 50, 4, 6};
    VoxelSize vs = new VoxelSize(0.5, 0.5, 2, "um", false);
    Raster image = Raster.grey(1, 2, 2, v, vs, PixelKind.FLOAT32);
    ObjectMeasurement m =
        ObjectMeasurements.measure(
                ObjectLabels.renumbered(1, 2, 2, labels), vs, image, new int[] {0})
            .get(0);
    assertThat(m.areaOrVolume()).isEqualTo(3 * 0.5);
    assertThat(m.channels().get(0).integratedDensity()).isEqualTo(12 * 0.5);
    assertThat(m.channels().get(0).mean()).isEqualTo(4.0);
    assertThat(m.centroidZ()).isCloseTo((2 / 3.0 + 0.5) * 2, within(1e-12));
    assertThat(m.boxDepth()).isEqualTo(2);
  }
}
