package io.github.cleave.bench;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.synth.SyntheticGridProblem;
import io.github.cleave.synth.SyntheticGridProblem.Flavour;
import java.util.List;

/**
 * One benchmark instance: a synthetic grid problem named {@code 2d-SIDE-nK-FLAVOUR} or {@code
 * 3d-SIDE-nK-FLAVOUR} (FLAVOUR {@code ordinary} or {@code boundary}), generated with seed 1 by
 * {@link SyntheticGridProblem#generate}. A suffix such as {@code -x1024} multiplies every capacity by that factor, so
 * that the same instance needs 32-bit residuals.
 */
record BenchInstance(
    String name, int side, boolean threeD, Neighborhood neighborhood, Flavour flavour, int scale) {

  /** The instances the issue asks for, smallest first. */
  static final List<String> ALL =
      List.of(
          "2d-1024-n4-ordinary",
          "2d-1024-n4-boundary",
          "2d-1024-n8-ordinary",
          "2d-1024-n8-boundary",
          "3d-128-n6-ordinary",
          "3d-128-n6-boundary",
          "2d-2048-n4-ordinary",
          "2d-2048-n4-boundary",
          "2d-2048-n8-ordinary",
          "2d-2048-n8-boundary",
          "3d-256-n6-ordinary",
          "3d-256-n6-boundary",
          "2d-1024-n8-ordinary-x1024",
          "3d-128-n6-ordinary-x1024");

  static final long SEED = 1;

  static BenchInstance parse(String name) {
    String[] parts = name.split("-");
    int scale = 1;
    if (parts.length == 5 && parts[4].startsWith("x")) {
      scale = Integer.parseInt(parts[4].substring(1));
    } else if (parts.length != 4) {
      parts = new String[0];
    }
    if (parts.length < 4 || !(parts[0].equals("2d") || parts[0].equals("3d"))) {
      throw new IllegalArgumentException(
          "instance '" + name + "': expected 2d|3d-SIDE-nK-ordinary|boundary, e.g. 2d-1024-n8-ordinary");
    }
    Flavour flavour =
        switch (parts[3]) {
          case "ordinary" -> Flavour.ORDINARY;
          case "boundary" -> Flavour.BOUNDARY_DOMINATED;
          default -> throw new IllegalArgumentException("flavour '" + parts[3] + "': ordinary or boundary");
        };
    return new BenchInstance(
        name,
        Integer.parseInt(parts[1]),
        parts[0].equals("3d"),
        Neighborhood.of(Integer.parseInt(parts[2].substring(1))),
        flavour,
        scale);
  }

  long nodes() {
    return threeD ? (long) side * side * side : (long) side * side;
  }

  SyntheticGridProblem generate() {
    SyntheticGridProblem p =
        SyntheticGridProblem.generate(side, side, threeD ? side : 1, neighborhood, flavour, SEED);
    return scale == 1 ? p : p.scaled(scale);
  }
}
