package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * New regional costs or new seeds applied to a solved graph and re-solved from the present flow
 * give what a graph built and solved from scratch with them gives: the same flow value and the same
 * minimal source set (Kohli and Torr, ICCV 2005: the dynamic solve must agree with a static one).
 */
class RegionalChangeTest {

  @Test
  void resolveAfterNewCostsEqualsAFreshSolve() {
    SplittableRandom random = new SplittableRandom(404L);
    for (int trial = 0; trial < 40; trial++) {
      boolean volume = random.nextInt(4) == 0;
      int w = 8 + random.nextInt(25);
      int h = 8 + random.nextInt(25);
      int d = volume ? 2 + random.nextInt(5) : 1;
      int n = w * h * d;
      Neighborhood nb = volume ? Neighborhood.N6 : Neighborhood.N8;
      float[] v = new float[n];
      byte[] seeds = new byte[n];
      for (int p = 0; p < n; p++) {
        v[p] = (float) Math.rint(random.nextDouble() * 255);
        int s = random.nextInt(40);
        seeds[p] = (byte) (s == 0 ? 1 : s == 1 ? 2 : 0);
      }
      Raster image = Raster.grey(w, h, d, v, VoxelSize.PIXELS, PixelKind.GREY8);
      SeedLabels seedLabels = new SeedLabels(w, h, d, seeds);
      EnergyParameters parameters =
          new EnergyParameters(
              random.nextDouble() * 4, 10 + random.nextDouble() * 60, nb, VoxelSize.PIXELS);
      boolean retain = random.nextBoolean();
      CutProblem dynamic =
          CutProblem.build(
              image, costs(random, n), costs(random, n), seedLabels, parameters, retain);
      dynamic.solve();
      for (int round = 0; round < 3; round++) {
        float[] fg = costs(random, n);
        float[] bg = costs(random, n);
        dynamic.changeRegionalCosts(fg, bg);
        MaxFlowResult again = dynamic.resolve();
        MaxFlowResult fresh = CutProblem.build(image, fg, bg, seedLabels, parameters, true).solve();
        assertThat(again.flowValue()).isEqualTo(fresh.flowValue());
        assertThat(again.sourceSide()).isEqualTo(fresh.sourceSide());
      }
    }
  }

  @Test
  void resolveAfterNewSeedsEqualsAFreshSolve() {
    SplittableRandom random = new SplittableRandom(505L);
    for (int trial = 0; trial < 40; trial++) {
      boolean volume = random.nextInt(4) == 0;
      int w = 8 + random.nextInt(25);
      int h = 8 + random.nextInt(25);
      int d = volume ? 2 + random.nextInt(5) : 1;
      int n = w * h * d;
      Neighborhood nb = volume ? Neighborhood.N6 : Neighborhood.N8;
      float[] v = new float[n];
      for (int p = 0; p < n; p++) {
        v[p] = (float) Math.rint(random.nextDouble() * 255);
      }
      Raster image = Raster.grey(w, h, d, v, VoxelSize.PIXELS, PixelKind.GREY8);
      EnergyParameters parameters =
          new EnergyParameters(
              random.nextDouble() * 4, 10 + random.nextDouble() * 60, nb, VoxelSize.PIXELS);
      float[] fg = costs(random, n);
      float[] bg = costs(random, n);
      CutProblem dynamic =
          CutProblem.build(image, fg, bg, seeds(random, w, h, d), parameters, random.nextBoolean());
      dynamic.solve();
      for (int round = 0; round < 3; round++) {
        SeedLabels next = seeds(random, w, h, d); // strokes added, erased and moved at once
        dynamic.changeSeeds(next);
        MaxFlowResult again = dynamic.resolve();
        MaxFlowResult fresh = CutProblem.build(image, fg, bg, next, parameters, true).solve();
        assertThat(again.flowValue()).isEqualTo(fresh.flowValue());
        assertThat(again.sourceSide()).isEqualTo(fresh.sourceSide());
      }
    }
  }

  private static SeedLabels seeds(SplittableRandom random, int w, int h, int d) {
    byte[] seeds = new byte[w * h * d];
    for (int p = 0; p < seeds.length; p++) {
      int s = random.nextInt(30);
      seeds[p] = (byte) (s == 0 ? 1 : s == 1 ? 2 : 0);
    }
    return new SeedLabels(w, h, d, seeds);
  }

  private static float[] costs(SplittableRandom random, int n) {
    float[] c = new float[n];
    for (int i = 0; i < n; i++) {
      c[i] = (float) (random.nextDouble() * 10);
    }
    return c;
  }
}
