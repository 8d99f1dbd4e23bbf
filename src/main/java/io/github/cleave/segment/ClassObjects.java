package io.github.cleave.segment;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.objects.ObjectLabels;
import io.github.cleave.objects.ObjectPipeline;
import io.github.cleave.objects.ObjectSettings;
import java.util.Arrays;

/**
 * The objects of a class map: for every class except the background, the voxels of that class go
 * through the same steps as a two-class mask (speck removal, then {@link ObjectPipeline}: holes,
 * splitting, filters), with that class's strokes for the per-stroke split; the objects of all
 * classes are then numbered together in first-voxel order. A hole is filled only with voxels the
 * cut gave to the background, so objects of different classes never overlap (a nucleus inside its
 * cytoplasm stays a hole of the cytoplasm). O(N · (K − 1)) for N voxels and K classes. Stateless.
 */
final class ClassObjects {
  private ClassObjects() {}

  /** The objects together and the class of each. */
  record Formed(ObjectLabels objects, int[] objectClasses) {}

  static Formed form(
      byte[] classes,
      int classCount,
      int w,
      int h,
      int d,
      VoxelSize voxelSize,
      ObjectSettings settings,
      SeedLabels seeds) {
    int n = classes.length;
    int[] combined = new int[n];
    byte[] seedLabels = seeds.labels();
    int offset = 0;
    int[] classOfOld = new int[1]; // class of each combined number before renumbering
    byte[] mask = new byte[n];
    byte[] strokes = new byte[n]; // this class's seeds as foreground seeds (1)
    for (int c = 1; c <= classCount; c++) {
      if (c == SeedLabels.BACKGROUND) {
        continue;
      }
      for (int i = 0; i < n; i++) {
        mask[i] = (classes[i] & 0xff) == c ? (byte) 255 : 0;
        strokes[i] = (seedLabels[i] & 0xff) == c ? (byte) SeedLabels.FOREGROUND : 0;
      }
      byte[] cleaned =
          MaskCleaning.withoutSpecks(
              mask, w, h, d, SegmentationSettings.SPECK_VOXELS, new SeedLabels(w, h, d, strokes));
      ObjectLabels objects = ObjectPipeline.run(cleaned, w, h, d, voxelSize, settings, strokes);
      int[] labels = objects.labels();
      for (int i = 0; i < n; i++) {
        int label = labels[i];
        // a filled hole may reach into another object-forming class: that voxel stays there
        if (label != 0 && combined[i] == 0 && ownOrBackground(classes[i] & 0xff, c)) {
          combined[i] = offset + label;
        }
      }
      classOfOld = Arrays.copyOf(classOfOld, offset + objects.count() + 1);
      Arrays.fill(classOfOld, offset + 1, classOfOld.length, c);
      offset += objects.count();
    }
    ObjectLabels together = ObjectLabels.renumbered(w, h, d, combined);
    int[] objectClasses = new int[together.count()];
    int[] numbers = together.labels();
    for (int i = 0; i < n; i++) {
      int label = numbers[i];
      if (label != 0 && objectClasses[label - 1] == 0) {
        objectClasses[label - 1] = classOfOld[combined[i]];
      }
    }
    return new Formed(together, objectClasses);
  }

  private static boolean ownOrBackground(int voxelClass, int objectClass) {
    return voxelClass == objectClass || voxelClass == SeedLabels.BACKGROUND;
  }
}
