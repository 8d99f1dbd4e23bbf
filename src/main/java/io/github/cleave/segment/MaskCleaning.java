package io.github.cleave.segment;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.ObjectLabels;
import io.github.cleave.objects.SpeckRemoval;

/**
 * Keeps the mask and the objects consistent. Before objects are formed, connected components of the
 * cut smaller than {@link SegmentationSettings#SPECK_VOXELS} voxels are removed from the mask: such
 * specks are noise pixels whose likelihood tipped over, not objects (an object resolved by the
 * microscope covers at least its point-spread function, a few pixels across; threshold: common
 * practice, no source). After the objects are formed, the mask is rewritten as the union of the
 * kept objects, so filled holes are in it and objects dropped by the size or edge filters are not:
 * a written mask and a written label image always agree. O(N): one scan of the mask, the rest works
 * on runs of foreground ({@link SpeckRemoval}). Stateless.
 */
final class MaskCleaning {
  private MaskCleaning() {}

  /**
   * A copy of {@code mask} (255/0) without the components smaller than {@code minVoxels}, except
   * those holding a foreground seed.
   */
  static byte[] withoutSpecks(byte[] mask, int w, int h, int d, int minVoxels, SeedLabels seeds) {
    return SpeckRemoval.withoutSpecks(mask, w, h, d, minVoxels, seeds.labels());
  }

  /** The mask of the kept objects: 255 where a label is nonzero, 0 elsewhere. */
  static byte[] union(ObjectLabels objects) {
    byte[] out = new byte[objects.size()];
    for (int i = 0; i < out.length; i++) {
      out[i] = objects.labelAt(i) != 0 ? (byte) 255 : 0;
    }
    return out;
  }
}
