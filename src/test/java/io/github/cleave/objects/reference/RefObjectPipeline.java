package io.github.cleave.objects.reference;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.objects.ObjectSettings;
import io.github.cleave.objects.ObjectSplit;

/**
 * The objects phase as it was before it was made faster (speck removal of {@code
 * segment.MaskCleaning}, then {@code ObjectPipeline.run}: holes, splitting, filters), kept
 * unchanged in test scope as the reference that the present code must match bit for bit. Returns
 * plain arrays; labels are renumbered in first-voxel order like {@code ObjectLabels}.
 */
public final class RefObjectPipeline {
  private RefObjectPipeline() {}

  /** The labels {@code ObjectPipeline.run} gave for these arguments. */
  public static int[] run(
      byte[] mask,
      int w,
      int h,
      int d,
      VoxelSize voxelSize,
      ObjectSettings settings,
      byte[] strokes) {
    byte[] m = settings.fillHoles() ? RefHoleFilling.fill(mask, w, h, d) : mask;
    int[] labels = split(m, w, h, d, voxelSize, settings.split(), strokes);
    int count = renumber(labels);
    return RefObjectFilters.filter(
        labels,
        count,
        w,
        h,
        d,
        voxelSize,
        settings.minSize(),
        settings.maxSize(),
        settings.excludeEdges(),
        settings.excludeEdgePlanes());
  }

  /**
   * The distance map (0 on the background) {@code DistanceMap.distance} gave, whole-grid layout.
   */
  public static float[] distance(
      byte[] mask, int w, int h, int d, double sx, double sy, double sz) {
    return RefDistanceMap.distance(mask, w, h, d, sx, sy, sz);
  }

  /** The marker labels {@code DistanceMarkers.markers} gave, whole-grid layout. */
  public static int[] markers(float[] dist, int w, int h, int d, float tolerance) {
    return RefDistanceMarkers.markers(dist, w, h, d, tolerance);
  }

  /** The mask {@code HoleFilling.fill} gave. */
  public static byte[] fillHoles(byte[] mask, int w, int h, int d) {
    return RefHoleFilling.fill(mask, w, h, d);
  }

  /** The labels (renumbered) {@code ObjectSplitting.split} gave. */
  public static int[] split(
      byte[] mask, int w, int h, int d, VoxelSize voxelSize, ObjectSplit method, byte[] strokes) {
    int[] labels =
        switch (method) {
          case NONE -> RefConnectedComponents.label(mask, w, h, d, null, 0);
          case DISTANCE_WATERSHED ->
              RefDistanceWatershed.split(
                  mask, w, h, d, voxelSize.x(), voxelSize.y(), voxelSize.z());
          case PER_STROKE -> perStroke(mask, w, h, d, strokes);
        };
    renumber(labels);
    return labels;
  }

  /** The mask {@code MaskCleaning.withoutSpecks} gave. */
  public static byte[] withoutSpecks(
      byte[] mask, int w, int h, int d, int minVoxels, SeedLabels seeds) {
    int[] parts = RefConnectedComponents.label(mask, w, h, d, null, 0);
    int count = renumber(parts);
    int[] sizes = new int[count + 1];
    for (int i = 0; i < mask.length; i++) {
      sizes[parts[i]]++;
    }
    byte[] seedLabels = seeds.labels();
    for (int i = 0; i < mask.length; i++) {
      if (seedLabels[i] == SeedLabels.FOREGROUND) {
        sizes[parts[i]] = Integer.MAX_VALUE;
      }
    }
    byte[] out = new byte[mask.length];
    for (int i = 0; i < mask.length; i++) {
      int k = parts[i];
      out[i] = k != 0 && sizes[k] >= minVoxels ? (byte) 255 : 0;
    }
    return out;
  }

  private static int[] perStroke(byte[] mask, int w, int h, int d, byte[] strokes) {
    byte[] inside = new byte[mask.length];
    for (int i = 0; i < inside.length; i++) {
      if (strokes[i] != 0 && mask[i] != 0) {
        inside[i] = 1;
      }
    }
    int[] pieces = RefConnectedComponents.label(inside, w, h, d, null, 0);
    return RefSeededGrowth.grow(mask, w, h, d, pieces);
  }

  /** Renumbers in place in first-voxel order (as {@code ObjectLabels.adopt}); returns the count. */
  private static int renumber(int[] labels) {
    int max = 0;
    for (int l : labels) {
      max = Math.max(max, l);
    }
    int[] map = new int[max + 1];
    int next = 0;
    for (int i = 0; i < labels.length; i++) {
      int old = labels[i];
      if (old != 0) {
        if (map[old] == 0) {
          map[old] = ++next;
        }
        labels[i] = map[old];
      }
    }
    return next;
  }
}
