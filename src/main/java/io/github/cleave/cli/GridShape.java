package io.github.cleave.cli;

import io.github.cleave.flow.Neighborhood;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * The size of a pixel grid given on the command line as {@code W,H} or {@code W,H,D}.
 *
 * @param width pixels along x, at least 1
 * @param height pixels along y, at least 1
 * @param depth planes along z, 1 for a 2D grid
 */
record GridShape(int width, int height, int depth) {

  long pixels() {
    return (long) width * height * depth;
  }

  /**
   * The neighbourhood named on the command line by its size {@code k} (null: 8 in 2D, 6 in 3D),
   * checked against this grid's dimension.
   *
   * @throws IllegalArgumentException with a message for the user if it does not exist or fit
   */
  Neighborhood neighborhood(Integer k) {
    int size = k != null ? k : depth > 1 ? 6 : 8;
    Neighborhood nb;
    try {
      nb = Neighborhood.of(size);
    } catch (IllegalArgumentException e) {
      throw new IllegalArgumentException(
          "--neighborhood " + size + ": use 4, 8 or 16 in 2D, 6, 18 or 26 in 3D");
    }
    if (depth > 1 && !nb.isThreeDimensional()) {
      throw new IllegalArgumentException(
          "--neighborhood "
              + size
              + " is two-dimensional but the grid has depth "
              + depth
              + "; use 6, 18 or 26");
    }
    return nb;
  }

  @Override
  public String toString() {
    return width + "x" + height + "x" + depth;
  }

  /** Parses {@code W,H[,D]}. */
  static final class Converter implements ITypeConverter<GridShape> {
    @Override
    public GridShape convert(String value) {
      String[] parts = value.split(",", -1);
      if (parts.length < 2 || parts.length > 3) {
        throw new TypeConversionException(
            "'" + value + "' is not W,H or W,H,D (for example 512,512 or 128,128,64)");
      }
      int[] sides = new int[3];
      sides[2] = 1;
      for (int i = 0; i < parts.length; i++) {
        try {
          sides[i] = Integer.parseInt(parts[i].trim());
        } catch (NumberFormatException e) {
          sides[i] = 0;
        }
        if (sides[i] < 1) {
          throw new TypeConversionException(
              "'" + value + "': every side must be a whole number of at least 1");
        }
      }
      return new GridShape(sides[0], sides[1], sides[2]);
    }
  }
}
