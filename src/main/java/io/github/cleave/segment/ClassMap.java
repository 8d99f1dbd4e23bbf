package io.github.cleave.segment;

import io.github.cleave.image.SeedLabels;

/**
 * The classes of a segmentation into three or more classes (seed labels 1..K; 2 is the background):
 * the class of every voxel as the cut gave it, and the class of every object. Objects are formed
 * per class from that class's voxels and numbered together in one label image, so an object number
 * names one object of one class. Immutable by convention: the arrays are shared, do not modify
 * them.
 *
 * @param classCount K, at least 3
 * @param labels class 1..K of every voxel, in the image's voxel order: the minimum of the Potts
 *     energy found by alpha-expansion, seeds honoured, before speck removal and object filters
 * @param objectClasses {@code objectClasses[i]} is the class of object {@code i + 1}
 */
public record ClassMap(int classCount, byte[] labels, int[] objectClasses) {

  /** Checks the class count and that every object's class is a foreground class. */
  public ClassMap {
    if (classCount < 3 || classCount > SeedLabels.MAX_CLASS) {
      throw new IllegalArgumentException(
          "class count " + classCount + ": a class map has 3 to " + SeedLabels.MAX_CLASS);
    }
    for (int c : objectClasses) {
      if (c < 1 || c > classCount || c == SeedLabels.BACKGROUND) {
        throw new IllegalArgumentException(
            "object class " + c + " must be 1 or 3.." + classCount + " (2 is the background)");
      }
    }
  }

  /** The class of object {@code number} (1-based, as in the label image). */
  public int classOf(int number) {
    return objectClasses[number - 1];
  }

  /** The number of objects of class {@code c}. */
  public int objectCount(int c) {
    int n = 0;
    for (int k : objectClasses) {
      if (k == c) {
        n++;
      }
    }
    return n;
  }

  /** The classes that form objects, in order: 1, 3, 4, .., K (every class but the background). */
  public int[] objectForming() {
    int[] out = new int[classCount - 1];
    int i = 0;
    for (int c = 1; c <= classCount; c++) {
      if (c != SeedLabels.BACKGROUND) {
        out[i++] = c;
      }
    }
    return out;
  }
}
