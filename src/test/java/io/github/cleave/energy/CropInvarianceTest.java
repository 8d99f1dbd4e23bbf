package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The fixed capacity scale ({@link CapacityScale}) keeps the graph of a region the same however the
 * image is cropped: with the same costs and contrast scale, every arc between two voxels of a crop
 * and every terminal arc of a non-seed voxel has the same capacity in the crop as in the whole
 * image (a property of the construction, no outside source).
 */
class CropInvarianceTest {

  @Test
  void interiorCapacitiesDoNotDependOnTheCrop() {
    SplittableRandom random = new SplittableRandom(99L);
    for (int trial = 0; trial < 30; trial++) {
      int w = 20 + random.nextInt(20);
      int h = 20 + random.nextInt(20);
      Neighborhood nb =
          new Neighborhood[] {Neighborhood.N4, Neighborhood.N8, Neighborhood.N16}
              [random.nextInt(3)];
      float[] values = new float[w * h];
      float[] fg = new float[w * h];
      float[] bg = new float[w * h];
      for (int i = 0; i < values.length; i++) {
        values[i] = (float) Math.rint(random.nextDouble() * 4000);
        fg[i] = (float) (random.nextDouble() * 12);
        bg[i] = (float) (random.nextDouble() * 12);
      }
      EnergyParameters parameters =
          new EnergyParameters(
              0.5 + random.nextDouble() * 8, 100 + random.nextDouble() * 900, nb, VoxelSize.PIXELS);
      GridMaxFlow whole = build(values, fg, bg, w, h, 0, 0, w, h, parameters);
      int x0 = random.nextInt(w / 2);
      int y0 = random.nextInt(h / 2);
      int cw = 5 + random.nextInt(w - x0 - 4);
      int ch = 5 + random.nextInt(h - y0 - 4);
      GridMaxFlow crop = build(values, fg, bg, w, h, x0, y0, cw, ch, parameters);
      for (int y = 0; y < ch; y++) {
        for (int x = 0; x < cw; x++) {
          int c = x + cw * y;
          int p = (x + x0) + w * (y + y0);
          assertThat(crop.sourceCapacity(c)).isEqualTo(whole.sourceCapacity(p));
          assertThat(crop.sinkCapacity(c)).isEqualTo(whole.sinkCapacity(p));
          for (int k = 0; k < nb.size(); k++) {
            if (crop.neighbor(c, k) >= 0) {
              assertThat(crop.neighborCapacity(c, k)).isEqualTo(whole.neighborCapacity(p, k));
            }
          }
        }
      }
    }
  }

  private static GridMaxFlow build(
      float[] values,
      float[] fg,
      float[] bg,
      int w,
      int h,
      int x0,
      int y0,
      int cw,
      int ch,
      EnergyParameters parameters) {
    float[] v = new float[cw * ch];
    float[] f = new float[cw * ch];
    float[] b = new float[cw * ch];
    for (int y = 0; y < ch; y++) {
      for (int x = 0; x < cw; x++) {
        int p = (x + x0) + w * (y + y0);
        v[x + cw * y] = values[p];
        f[x + cw * y] = fg[p];
        b[x + cw * y] = bg[p];
      }
    }
    Raster r = Raster.grey(cw, ch, 1, v, VoxelSize.PIXELS, PixelKind.GREY16);
    return CutProblem.build(r, f, b, SeedLabels.empty(cw, ch, 1), parameters, true).solver();
  }
}
