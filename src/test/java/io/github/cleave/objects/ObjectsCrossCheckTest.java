package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.image.VoxelSize;
import io.github.cleave.objects.reference.RandomMasks;
import io.github.cleave.objects.reference.RefObjectPipeline;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The objects phase gives exactly the labels of its earlier, plainer implementation (kept in test
 * scope as {@link RefObjectPipeline}): hole filling, every split method, the filters and the whole
 * pipeline are compared voxel for voxel over many seeded random planes and stacks with touching
 * shapes, holes, edge-touching objects, lines and specks, and on generated phantoms.
 */
class ObjectsCrossCheckTest {

  private static int[] dims(SplittableRandom rnd, boolean stack) {
    if (!stack) {
      return rnd.nextInt(6) == 0
          ? new int[] {rnd.nextInt(1, 5), rnd.nextInt(1, 40), 1} // degenerate thin planes
          : new int[] {rnd.nextInt(5, 130), rnd.nextInt(5, 130), 1};
    }
    return rnd.nextInt(6) == 0
        ? new int[] {rnd.nextInt(1, 4), rnd.nextInt(1, 12), rnd.nextInt(2, 6)}
        : new int[] {rnd.nextInt(4, 40), rnd.nextInt(4, 40), rnd.nextInt(2, 14)};
  }

  private static ObjectSettings settings(SplittableRandom rnd, VoxelSize vs, int n) {
    ObjectSplit split = ObjectSplit.values()[rnd.nextInt(ObjectSplit.values().length)];
    double unit = vs.x() * vs.y() * vs.z();
    double min = rnd.nextBoolean() ? 0 : rnd.nextInt(0, 30) * unit;
    double max = rnd.nextBoolean() ? 0 : min + rnd.nextInt(0, n + 1) * unit;
    return new ObjectSettings(
        rnd.nextBoolean(), split, min, max, rnd.nextBoolean(), rnd.nextBoolean());
  }

  @Test
  void splittingMatchesTheReferenceOnRandomPlanesAndStacks() {
    SplittableRandom rnd = new SplittableRandom(20261202L);
    for (int t = 0; t < 600; t++) {
      int[] s = dims(rnd, t % 3 == 2);
      int w = s[0];
      int h = s[1];
      int d = s[2];
      byte[] mask = RandomMasks.mask(rnd, w, h, d);
      VoxelSize vs = d == 1 ? VoxelSize.PIXELS : RandomMasks.voxelSize(rnd);
      byte[] strokes = RandomMasks.strokes(rnd, w, h, d);
      byte[] before = mask.clone();
      for (ObjectSplit method : ObjectSplit.values()) {
        int[] expected = RefObjectPipeline.split(mask, w, h, d, vs, method, strokes);
        ObjectLabels actual = ObjectSplitting.split(mask, w, h, d, vs, method, strokes);
        assertThat(actual.labels())
            .as("trial %d, %s, %d x %d x %d", t, method, w, h, d)
            .isEqualTo(expected);
      }
      assertThat(HoleFilling.fill(mask, w, h, d))
          .as("holes, trial %d", t)
          .isEqualTo(RefObjectPipeline.fillHoles(mask, w, h, d));
      assertThat(mask).as("input unchanged, trial %d", t).isEqualTo(before);
    }
  }

  @Test
  void pipelineMatchesTheReferenceOnRandomPlanesAndStacks() {
    SplittableRandom rnd = new SplittableRandom(7);
    for (int t = 0; t < 600; t++) {
      int[] s = dims(rnd, t % 2 == 1);
      int w = s[0];
      int h = s[1];
      int d = s[2];
      byte[] mask = RandomMasks.mask(rnd, w, h, d);
      VoxelSize vs = RandomMasks.voxelSize(rnd);
      ObjectSettings settings = settings(rnd, vs, mask.length);
      byte[] strokes = RandomMasks.strokes(rnd, w, h, d);
      int[] expected = RefObjectPipeline.run(mask, w, h, d, vs, settings, strokes);
      ObjectLabels actual = ObjectPipeline.run(mask, w, h, d, vs, settings, strokes);
      assertThat(actual.labels())
          .as("trial %d, %s, %d x %d x %d", t, settings, w, h, d)
          .isEqualTo(expected);
    }
  }

  @Test
  void pipelineMatchesTheReferenceOnPhantoms() {
    for (long seed : new long[] {SamplePhantoms.DEFAULT_SEED, 1, 2}) {
      for (Phantom p :
          new Phantom[] {
            SamplePhantoms.nuclei(seed, 256, 256), SamplePhantoms.stack(seed, 96, 96, 16)
          }) {
        int w = p.image().width();
        int h = p.image().height();
        int d = p.image().depth();
        VoxelSize vs = p.image().voxelSize();
        SplittableRandom rnd = new SplittableRandom(seed);
        byte[] mask = new byte[p.truth().length];
        for (int i = 0; i < mask.length; i++) { // the truth with a little flipped noise
          boolean on = p.truth()[i] != 0;
          mask[i] = on ^ (rnd.nextInt(50) == 0) ? (byte) 255 : 0;
        }
        for (ObjectSettings settings :
            new ObjectSettings[] {
              new ObjectSettings(true, ObjectSplit.DISTANCE_WATERSHED, 0, 0, false),
              new ObjectSettings(false, ObjectSplit.DISTANCE_WATERSHED, 0, 0, true, true),
              new ObjectSettings(true, ObjectSplit.NONE, 3 * vs.voxelVolume(), 0, true)
            }) {
          int[] expected = RefObjectPipeline.run(mask, w, h, d, vs, settings, null);
          assertThat(ObjectPipeline.run(mask, w, h, d, vs, settings, null).labels())
              .as("%s seed %d %s", p.name(), seed, settings)
              .isEqualTo(expected);
        }
      }
    }
  }
}
