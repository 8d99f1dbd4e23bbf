package io.github.cleave.objects;

import io.github.cleave.image.VoxelSize;

/**
 * Everything between a binary mask and the final objects, in a fixed order: fill holes (optional) →
 * connected components or splitting of touching objects → size and edge filters → renumbering in
 * first-voxel order. Same inputs give the same labels, bit for bit. Stateless and thread-safe.
 */
public final class ObjectPipeline {
  private ObjectPipeline() {}

  /**
   * @param mask {@code w·h·d} values, row-major ({@code x + w·(y + h·z)}), nonzero = foreground;
   *     not modified
   * @param voxelSize calibration: size limits are in its unit, the 3D watershed uses its spacing
   * @param strokes foreground stroke voxels (nonzero) in the same layout, needed only for {@link
   *     ObjectSplit#PER_STROKE}; may be null otherwise
   * @throws IllegalArgumentException if an array does not match the dimensions or strokes are
   *     missing for {@code PER_STROKE}
   */
  public static ObjectLabels run(
      byte[] mask,
      int w,
      int h,
      int d,
      VoxelSize voxelSize,
      ObjectSettings settings,
      byte[] strokes) {
    Grids.check(mask.length, w, h, d, "mask");
    byte[] m = settings.fillHoles() ? HoleFilling.fill(mask, w, h, d) : mask;
    ObjectLabels objects = ObjectSplitting.split(m, w, h, d, voxelSize, settings.split(), strokes);
    return ObjectFilters.apply(objects, voxelSize, settings);
  }
}
