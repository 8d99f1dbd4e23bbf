package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.BadInputException;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ObjectPipelineTest {

  /** Squares of side s at the given top-left corners on a w x h plane. */
  private static byte[] squares(int w, int h, int s, int... corners) {
    byte[] m = new byte[w * h];
    for (int k = 0; k < corners.length; k += 2) {
      for (int y = corners[k + 1]; y < corners[k + 1] + s; y++) {
        for (int x = corners[k]; x < corners[k] + s; x++) {
          m[x + w * y] = 1;
        }
      }
    }
    return m;
  }

  @Test
  void sizeLimitsAreInCalibratedUnits() {
    byte[] mask = new byte[30 * 10];
    // objects of 4, 9 and 25 pixels; pixel 0.5 x 0.4 um = 0.2 um^2 -> 0.8, 1.8, 5.0 um^2
    for (int[] sq : new int[][] {{1, 1, 2}, {6, 1, 3}, {12, 1, 5}}) {
      for (int y = sq[1]; y < sq[1] + sq[2]; y++) {
        for (int x = sq[0]; x < sq[0] + sq[2]; x++) {
          mask[x + 30 * y] = 1;
        }
      }
    }
    VoxelSize vs = new VoxelSize(0.5, 0.4, 7, "um", false);
    ObjectLabels all = ConnectedComponents.of(mask, 30, 10, 1);
    assertThat(ObjectFilters.filter(all, vs, 1.0, 0, false, false).count()).isEqualTo(2);
    assertThat(ObjectFilters.filter(all, vs, 0, 2.0, false, false).count()).isEqualTo(2);
    ObjectLabels middle = ObjectFilters.filter(all, vs, 1.8, 1.8, false, false);
    assertThat(middle.count()).isEqualTo(1);
    assertThat(middle.label(6, 1, 0)).isEqualTo(1); // renumbered from 2 to 1
    assertThat(middle.label(1, 1, 0)).isZero();
    assertThat(ObjectFilters.filter(all, vs, 0, Double.POSITIVE_INFINITY, false, false))
        .isEqualTo(all);
    // In a stack the limit is a volume: the same mask as a 1-plane stack twice over.
    byte[] stack = new byte[mask.length * 2];
    System.arraycopy(mask, 0, stack, 0, mask.length);
    System.arraycopy(mask, 0, stack, mask.length, mask.length);
    ObjectLabels s = ConnectedComponents.of(stack, 30, 10, 2);
    // volumes 8, 18, 50 voxels x 1.4 um^3 = 11.2, 25.2, 70
    assertThat(ObjectFilters.filter(s, vs, 20, 60, false, false).count()).isEqualTo(1);
  }

  @Test
  void edgeExclusionAndRenumbering() {
    int w = 20;
    int h = 12;
    // first object touches the top edge, second is inside, third touches the right edge
    byte[] mask = squares(w, h, 3, 2, 0, 8, 4, 17, 8);
    ObjectLabels all = ConnectedComponents.of(mask, w, h, 1);
    assertThat(all.count()).isEqualTo(3);
    ObjectLabels inner = ObjectFilters.filter(all, VoxelSize.PIXELS, 0, 0, true, false);
    assertThat(inner.count()).isEqualTo(1);
    assertThat(inner.label(9, 5, 0)).isEqualTo(1);

    // Stack: an object on the first plane only is kept unless edge planes are excluded.
    int d = 3;
    byte[] stack = new byte[w * h * d];
    System.arraycopy(squares(w, h, 3, 8, 4), 0, stack, 0, w * h);
    System.arraycopy(squares(w, h, 3, 3, 3), 0, stack, w * h, w * h);
    ObjectLabels s = ConnectedComponents.of(stack, w, h, d);
    assertThat(s.count()).isEqualTo(2);
    assertThat(ObjectFilters.filter(s, VoxelSize.PIXELS, 0, 0, true, false).count()).isEqualTo(2);
    ObjectLabels z = ObjectFilters.filter(s, VoxelSize.PIXELS, 0, 0, true, true);
    assertThat(z.count()).isEqualTo(1);
    assertThat(z.label(3, 3, 1)).isEqualTo(1);
  }

  @Test
  void pipelineFillsSplitsFiltersAndNumbersByFirstVoxel() {
    int w = 90;
    int h = 50;
    byte[] mask = new byte[w * h];
    Phantoms.disk(mask, w, h, 1, 1, 25, 25, 14);
    Phantoms.disk(mask, w, h, 1, 1, 48, 25, 14); // touches the first
    Phantoms.disk(mask, w, h, 1, 1, 78, 10, 3); // small
    Phantoms.disk(mask, w, h, 1, 1, 3, 46, 6); // on the edge
    byte[] holes = mask.clone();
    holes[25 + w * 25] = 0; // a one-pixel hole in the first disk
    holes[26 + w * 25] = 0;
    ObjectSettings settings =
        new ObjectSettings(true, ObjectSplit.DISTANCE_WATERSHED, 100, 0, true);
    ObjectLabels labels = ObjectPipeline.run(holes, w, h, 1, VoxelSize.PIXELS, settings, null);
    assertThat(labels.count()).isEqualTo(2);
    assertThat(labels.label(25, 25, 0)).isEqualTo(1);
    assertThat(labels.label(48, 25, 0)).isEqualTo(2);
    assertThat(labels.label(78, 10, 0)).isZero();
    assertThat(labels.label(3, 46, 0)).isZero();
    // Numbering: objects appear in row-major order of their first voxel.
    int seen = 0;
    for (int i = 0; i < labels.size(); i++) {
      int l = labels.labelAt(i);
      assertThat(l).isLessThanOrEqualTo(seen + 1);
      seen = Math.max(seen, l);
    }
    // Deterministic: same input, same labels.
    assertThat(ObjectPipeline.run(holes, w, h, 1, VoxelSize.PIXELS, settings, null))
        .isEqualTo(labels);
    // Without filling, the hole stays background.
    ObjectLabels unfilled =
        ObjectPipeline.run(
            holes,
            w,
            h,
            1,
            VoxelSize.PIXELS,
            new ObjectSettings(false, ObjectSplit.NONE, 0, 0, false),
            null);
    assertThat(unfilled.label(25, 25, 0)).isZero();
    assertThat(unfilled.count()).isEqualTo(3);
  }

  @Test
  void filtersKeepFirstVoxelOrderOnRandomLabels() {
    SplittableRandom rnd = new SplittableRandom(41);
    for (int t = 0; t < 50; t++) {
      int w = 5 + rnd.nextInt(20);
      int h = 5 + rnd.nextInt(20);
      byte[] mask = Phantoms.noise(rnd, w * h, 0.3);
      ObjectLabels all = ConnectedComponents.of(mask, w, h, 1);
      ObjectLabels kept =
          ObjectFilters.filter(all, VoxelSize.PIXELS, 2, 0, rnd.nextBoolean(), false);
      // Renumbered result equals a fresh labelling of what was kept.
      assertThat(ConnectedComponents.of(kept.toMask(), w, h, 1)).isEqualTo(kept);
      long[] sizes = kept.voxelCounts();
      for (int l = 1; l <= kept.count(); l++) {
        assertThat(sizes[l]).isGreaterThanOrEqualTo(2);
      }
    }
  }

  @Test
  void badSettingsAreRefusedWithAMessage() {
    assertThatThrownBy(() -> new ObjectSettings(false, ObjectSplit.NONE, 10, 5, false))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("10.0");
    assertThatThrownBy(() -> new ObjectSettings(false, ObjectSplit.NONE, -1, 0, false))
        .isInstanceOf(BadInputException.class);
    assertThatThrownBy(
            () ->
                ObjectPipeline.run(
                    new byte[4],
                    2,
                    2,
                    1,
                    VoxelSize.PIXELS,
                    new ObjectSettings(false, ObjectSplit.PER_STROKE, 0, 0, false),
                    null))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("strokes");
    assertThatThrownBy(() -> ConnectedComponents.of(new byte[5], 2, 2, 1))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("2 x 2 x 1");
  }
}
