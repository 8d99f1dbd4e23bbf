package io.github.cleave.cli;

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
