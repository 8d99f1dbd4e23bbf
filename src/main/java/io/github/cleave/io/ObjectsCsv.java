package io.github.cleave.io;

import io.github.cleave.objects.ChannelStatistics;
import io.github.cleave.objects.ObjectMeasurement;
import java.util.List;
import java.util.Locale;

/**
 * The per-object measurements table (DESIGN.md: {@code NAME.objects.csv}, and a folder run's {@code
 * objects.csv} with a leading {@code file} column). Comma-separated, one header row, dot decimals
 * ({@link Locale#ROOT}) whatever the machine's locale, numbers with six decimals, rows in
 * object-number order: the same objects always give the same bytes.
 *
 * <p>Columns for a plane: {@code object, pixels, area_U2, centroid_x_U, centroid_y_U, box_x, box_y,
 * box_width, box_height, perimeter_U}, then per measured channel N (numbered from 1) {@code
 * cN_mean, cN_min, cN_max, cN_integrated_U2, cN_raw_sum}; for a stack {@code voxels, volume_U3}, a
 * z centroid, {@code box_z, box_depth}, {@code surface_U2} and {@code cN_integrated_U3}. {@code U}
 * is the calibration unit in ASCII ({@code µm} becomes {@code um}); box columns are in pixels,
 * 0-based. A segmentation into three or more classes adds a {@code class} column (the seed label of
 * the object's class) after {@code object}.
 */
public final class ObjectsCsv {
  private ObjectsCsv() {}

  /** The header row (without line end). */
  public static String header(boolean stack, String unit, int[] channels, boolean withFile) {
    return header(stack, unit, channels, withFile, false);
  }

  /** The header row (without line end), with a {@code class} column if {@code withClass}. */
  public static String header(
      boolean stack, String unit, int[] channels, boolean withFile, boolean withClass) {
    String u = asciiUnit(unit);
    StringBuilder sb = new StringBuilder();
    if (withFile) {
      sb.append("file,");
    }
    sb.append("object,");
    if (withClass) {
      sb.append("class,");
    }
    if (stack) {
      sb.append("voxels,volume_").append(u).append("3,");
      sb.append("centroid_x_").append(u).append(",centroid_y_").append(u);
      sb.append(",centroid_z_").append(u).append(',');
      sb.append("box_x,box_y,box_z,box_width,box_height,box_depth,surface_").append(u).append('2');
    } else {
      sb.append("pixels,area_").append(u).append("2,");
      sb.append("centroid_x_").append(u).append(",centroid_y_").append(u).append(',');
      sb.append("box_x,box_y,box_width,box_height,perimeter_").append(u);
    }
    for (int c : channels) {
      String p = "c" + (c + 1) + "_";
      sb.append(',').append(p).append("mean,").append(p).append("min,").append(p).append("max,");
      sb.append(p).append("integrated_").append(u).append(stack ? '3' : '2');
      sb.append(',').append(p).append("raw_sum");
    }
    return sb.toString();
  }

  /** One row (without line end); {@code file} is null unless the table has a file column. */
  public static String row(ObjectMeasurement m, boolean stack, String file) {
    return row(m, stack, file, 0);
  }

  /** One row, with the object's class in a {@code class} column unless {@code objectClass} is 0. */
  public static String row(ObjectMeasurement m, boolean stack, String file, int objectClass) {
    StringBuilder sb = new StringBuilder();
    if (file != null) {
      sb.append(quoted(file)).append(',');
    }
    sb.append(m.label()).append(',');
    if (objectClass != 0) {
      sb.append(objectClass).append(',');
    }
    sb.append(m.voxelCount()).append(',');
    sb.append(number(m.areaOrVolume())).append(',');
    sb.append(number(m.centroidX())).append(',').append(number(m.centroidY())).append(',');
    if (stack) {
      sb.append(number(m.centroidZ())).append(',');
      sb.append(m.boxX()).append(',').append(m.boxY()).append(',').append(m.boxZ()).append(',');
      sb.append(m.boxWidth()).append(',').append(m.boxHeight()).append(',');
      sb.append(m.boxDepth()).append(',');
    } else {
      sb.append(m.boxX()).append(',').append(m.boxY()).append(',');
      sb.append(m.boxWidth()).append(',').append(m.boxHeight()).append(',');
    }
    sb.append(number(m.perimeterOrSurface()));
    for (ChannelStatistics c : m.channels()) {
      sb.append(',').append(number(c.mean()));
      sb.append(',').append(number(c.min()));
      sb.append(',').append(number(c.max()));
      sb.append(',').append(number(c.integratedDensity()));
      sb.append(',').append(number(c.rawIntegratedDensity()));
    }
    return sb.toString();
  }

  /** The whole table for one image, with line ends {@code \n}. */
  public static String table(
      List<ObjectMeasurement> measurements, boolean stack, String unit, int[] channels) {
    return table(measurements, stack, unit, channels, null);
  }

  /**
   * The whole table, with a {@code class} column when {@code objectClasses} (the class of object i
   * + 1 at index i) is not null.
   */
  public static String table(
      List<ObjectMeasurement> measurements,
      boolean stack,
      String unit,
      int[] channels,
      int[] objectClasses) {
    StringBuilder sb =
        new StringBuilder(header(stack, unit, channels, false, objectClasses != null)).append('\n');
    for (ObjectMeasurement m : measurements) {
      int c = objectClasses == null ? 0 : objectClasses[m.label() - 1];
      sb.append(row(m, stack, null, c)).append('\n');
    }
    return sb.toString();
  }

  /**
   * The leading columns of a time-lapse table: {@code frame} and, when the frame interval is known
   * (not NaN), {@code time_U} in the time unit U.
   */
  public static String frameHeader(double frameInterval, String timeUnit) {
    return Double.isNaN(frameInterval) ? "frame," : "frame,time_" + asciiUnit(timeUnit) + ",";
  }

  /**
   * The rows of one time point, each led by {@code frame + 1} and, when {@code frameInterval} is
   * not NaN, the time {@code frame · frameInterval}: objects in their order in {@code
   * measurements}, with a class column when {@code classOf} (tracked number to class) is not null.
   */
  public static void frameRows(
      StringBuilder out,
      int frame,
      double frameInterval,
      List<ObjectMeasurement> measurements,
      boolean stack,
      java.util.function.IntUnaryOperator classOf) {
    String lead =
        Double.isNaN(frameInterval)
            ? (frame + 1) + ","
            : (frame + 1) + "," + number(frame * frameInterval) + ",";
    for (ObjectMeasurement m : measurements) {
      int c = classOf == null ? 0 : classOf.applyAsInt(m.label());
      out.append(lead).append(row(m, stack, null, c)).append('\n');
    }
  }

  /** A number with six decimals, dot decimal separator. */
  static String number(double v) {
    if (Double.isNaN(v)) {
      return "NaN";
    }
    return String.format(Locale.ROOT, "%.6f", v);
  }

  /** The unit in ASCII letters, digits and underscores ({@code µm} → {@code um}). */
  static String asciiUnit(String unit) {
    String u = unit.replace('\u00b5', 'u').replace('\u03bc', 'u');
    StringBuilder sb = new StringBuilder();
    for (char ch : u.toCharArray()) {
      sb.append(ch < 128 && (Character.isLetterOrDigit(ch)) ? ch : '_');
    }
    return sb.length() == 0 ? "unit" : sb.toString();
  }

  private static String quoted(String s) {
    if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0) {
      return s;
    }
    return '"' + s.replace("\"", "\"\"") + '"';
  }
}
