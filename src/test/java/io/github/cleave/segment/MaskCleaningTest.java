package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.reference.RandomMasks;
import io.github.cleave.objects.reference.RefObjectPipeline;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Speck removal gives exactly the mask of its earlier implementation (kept in test scope in {@link
 * RefObjectPipeline}) on many seeded random planes and stacks, with random seed strokes of every
 * class, and never keeps a component smaller than the limit that holds no foreground seed.
 */
class MaskCleaningTest {
  @Test
  void speckRemovalMatchesTheReference() {
    SplittableRandom rnd = new SplittableRandom(11);
    for (int t = 0; t < 800; t++) {
      boolean stack = t % 2 == 1;
      int w = rnd.nextInt(1, stack ? 40 : 130);
      int h = rnd.nextInt(1, stack ? 40 : 130);
      int d = stack ? rnd.nextInt(2, 12) : 1;
      byte[] mask = RandomMasks.mask(rnd, w, h, d);
      byte[] seedLabels = new byte[mask.length];
      byte[] strokes = RandomMasks.strokes(rnd, w, h, d);
      for (int i = 0; i < mask.length; i++) {
        if (strokes[i] != 0) {
          seedLabels[i] = (byte) rnd.nextInt(1, 4);
        }
      }
      SeedLabels seeds = new SeedLabels(w, h, d, seedLabels);
      int min = rnd.nextInt(0, 40);
      byte[] before = mask.clone();
      assertThat(MaskCleaning.withoutSpecks(mask, w, h, d, min, seeds))
          .as("trial %d, %d x %d x %d, limit %d", t, w, h, d, min)
          .isEqualTo(RefObjectPipeline.withoutSpecks(mask, w, h, d, min, seeds));
      assertThat(mask).isEqualTo(before);
    }
  }
}
