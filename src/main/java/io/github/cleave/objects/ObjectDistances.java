package io.github.cleave.objects;

import io.github.cleave.image.VoxelSize;

/**
 * Exact Euclidean distances on a grid in calibrated units, for other packages: the distance of
 * every foreground voxel to the background, and of every object voxel to the nearest voxel that is
 * not of its own object. Both come from {@link DistanceMap} (Felzenszwalb and Huttenlocher, Theory
 * of Computing 8(19):415–428, 2012): distances between voxel centres, anisotropic voxel sizes
 * honoured, voxels outside the image are <em>not</em> background (an object cut by the image edge
 * is not eroded from that edge), and {@link Float#POSITIVE_INFINITY} where no such voxel exists.
 *
 * <p>Grids are row-major ({@code i = x + w·(y + h·z)}). Stateless and thread-safe.
 */
public final class ObjectDistances {
  private ObjectDistances() {}

  /**
   * For every voxel with {@code mask[i] != 0}, the distance from its centre to the centre of the
   * nearest voxel with {@code mask[i] == 0}; 0 for those voxels themselves. Time and memory about
   * proportional to the foreground plus O(w·h + h·d).
   *
   * @throws IllegalArgumentException if the mask does not have {@code w·h·d} values
   */
  public static float[] toBackground(byte[] mask, int w, int h, int d, VoxelSize size) {
    Grids.check(mask.length, w, h, d, "mask");
    float[] out = new float[mask.length];
    ForegroundRuns runs = ForegroundRuns.of(mask, null, w, h, d);
    int[] slots = runs.slotStarts();
    float[] dist = DistanceMap.distance(runs, slots, size.x(), size.y(), size.z());
    for (int r = 0, s = 0; r < runs.count; r++) {
      int base = runs.row[r] * w;
      for (int x = runs.start[r]; x <= runs.end[r]; x++) {
        out[base + x] = dist[s++];
      }
    }
    return out;
  }

  /**
   * For every voxel with a label {@code k > 0}, the distance from its centre to the nearest voxel
   * whose label is not {@code k} (background or another object); 0 on background. Each object is
   * transformed on its own bounding box grown by one voxel (clamped to the image): every voxel of
   * that rim is not of the object, and any voxel beyond it is farther than the rim voxel at its
   * clamped position, so the result is the same as a transform of the whole grid per object. Time
   * O(Σ bounding-box volumes + N + largest label).
   *
   * @throws IllegalArgumentException if the array does not have {@code w·h·d} values or a label is
   *     negative
   */
  public static float[] toOtherLabels(int[] labels, int w, int h, int d, VoxelSize size) {
    Grids.check(labels.length, w, h, d, "label image");
    int max = 0;
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] < 0) {
        throw new IllegalArgumentException(
            "label " + labels[i] + " at index " + i + ": labels must be 0 or positive");
      }
      max = Math.max(max, labels[i]);
    }
    int[] box = new int[6 * (max + 1)]; // x0, y0, z0, x1, y1, z1 per label; x0 > x1 when absent
    for (int k = 0; k <= max; k++) {
      box[6 * k] = Integer.MAX_VALUE;
    }
    for (int z = 0, i = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++, i++) {
          int k = labels[i];
          if (k == 0) {
            continue;
          }
          int b = 6 * k;
          if (box[b] == Integer.MAX_VALUE) {
            box[b] = x;
            box[b + 1] = y;
            box[b + 2] = z;
            box[b + 3] = x;
            box[b + 4] = y;
            box[b + 5] = z;
          } else {
            box[b] = Math.min(box[b], x);
            box[b + 1] = Math.min(box[b + 1], y);
            box[b + 3] = Math.max(box[b + 3], x);
            box[b + 4] = Math.max(box[b + 4], y);
            box[b + 5] = z; // z only grows in this scan
          }
        }
      }
    }
    float[] out = new float[labels.length];
    for (int k = 1; k <= max; k++) {
      int b = 6 * k;
      if (box[b] == Integer.MAX_VALUE) {
        continue;
      }
      int x0 = Math.max(0, box[b] - 1);
      int y0 = Math.max(0, box[b + 1] - 1);
      int z0 = Math.max(0, box[b + 2] - 1);
      int x1 = Math.min(w - 1, box[b + 3] + 1);
      int y1 = Math.min(h - 1, box[b + 4] + 1);
      int z1 = Math.min(d - 1, box[b + 5] + 1);
      int cw = x1 - x0 + 1;
      int ch = y1 - y0 + 1;
      int cd = z1 - z0 + 1;
      byte[] crop = new byte[cw * ch * cd];
      for (int z = z0, c = 0; z <= z1; z++) {
        for (int y = y0; y <= y1; y++) {
          int row = x0 + w * (y + h * z);
          for (int x = 0; x < cw; x++, c++) {
            crop[c] = labels[row + x] == k ? (byte) 255 : 0;
          }
        }
      }
      float[] inside = toBackground(crop, cw, ch, cd, size);
      for (int z = z0, c = 0; z <= z1; z++) {
        for (int y = y0; y <= y1; y++) {
          int row = x0 + w * (y + h * z);
          for (int x = 0; x < cw; x++, c++) {
            if (crop[c] != 0) {
              out[row + x] = inside[c];
            }
          }
        }
      }
    }
    return out;
  }
}
