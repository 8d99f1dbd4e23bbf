package io.github.cleave.batch;

import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.TimeAxis;
import io.github.cleave.render.DisplayRange;
import io.github.cleave.segment.SegmentationModel;
import java.io.Serializable;
import java.nio.file.Path;

/**
 * Everything the per-file function of a folder run needs, as plain serialisable values: the model
 * file's path, bytes and SHA-256, the input folder (absolute, normalised, as the scan saw it), the
 * output and seeds folders as given, the resume and time settings, and the run's display ranges.
 * Made on the driver by {@link PreparedRun#spec()}; a distributed engine ships it (once) to every
 * worker, which opens a {@link FileTask} from it. Holds no thread, file handle or lock; immutable
 * (the arrays are copied in and never handed out).
 *
 * <p>Paths are strings so that the value serialises; they must mean the same file on every machine
 * that runs a {@link FileTask} (a shared mount at the same path).
 */
public final class RunSpec implements Serializable {
  private static final long serialVersionUID = 1L;

  private final String model;
  private final byte[] modelJson;
  private final String modelSha256;
  private final String in;
  private final String out;
  private final String seeds;
  private final boolean overwrite;
  private final TimeAxis timeAxis;
  private final int seedFrame;
  private final boolean seedsFromNeighbour;
  private final double[] ranges; // min0, max0, min1, max1, ...; null for "each picture its own"

  RunSpec(BatchSettings s, byte[] modelJson, String modelSha256, Path in, DisplayRange[] ranges) {
    this.model = s.model().toString();
    this.modelJson = modelJson.clone();
    this.modelSha256 = modelSha256;
    this.in = in.toString();
    this.out = s.out().toString();
    this.seeds = s.seeds() == null ? null : s.seeds().toString();
    this.overwrite = s.overwrite();
    this.timeAxis = s.timeAxis();
    this.seedFrame = s.seedFrame();
    this.seedsFromNeighbour = s.seedsFromNeighbour();
    if (ranges == null) {
      this.ranges = null;
    } else {
      this.ranges = new double[2 * ranges.length];
      for (int c = 0; c < ranges.length; c++) {
        this.ranges[2 * c] = ranges[c].min();
        this.ranges[2 * c + 1] = ranges[c].max();
      }
    }
  }

  private RunSpec(RunSpec base, boolean overwrite) {
    this(base, overwrite, base.model, base.in, base.out, base.seeds);
  }

  private RunSpec(
      RunSpec base, boolean overwrite, String model, String in, String out, String seeds) {
    this.model = model;
    this.modelJson = base.modelJson;
    this.modelSha256 = base.modelSha256;
    this.in = in;
    this.out = out;
    this.seeds = seeds;
    this.overwrite = overwrite;
    this.timeAxis = base.timeAxis;
    this.seedFrame = base.seedFrame;
    this.seedsFromNeighbour = base.seedsFromNeighbour;
    this.ranges = base.ranges;
  }

  /** Whether files whose outputs are complete are recomputed instead of kept. */
  boolean overwrites() {
    return overwrite;
  }

  /** The same run, recomputing files whose outputs are complete instead of keeping them. */
  RunSpec overwriting() {
    return overwrite ? this : new RunSpec(this, true);
  }

  /**
   * The same run on other paths: a model file with this run's model bytes, and input, output and
   * seeds folders laid out as this run's (seeds may be null).
   */
  RunSpec at(Path model, Path in, Path out, Path seeds) {
    return new RunSpec(
        this,
        overwrite,
        model.toString(),
        in.toAbsolutePath().normalize().toString(),
        out.toString(),
        seeds == null ? null : seeds.toString());
  }

  /** The model's JSON bytes, as read on the driver (a copy). */
  public byte[] modelJson() {
    return modelJson.clone();
  }

  /** The settings a file of this run sees (one thread, the default heap budget). */
  BatchSettings settings() {
    return new BatchSettings(
        Path.of(model),
        Path.of(in),
        Path.of(out),
        seeds == null ? null : Path.of(seeds),
        1,
        null,
        false,
        overwrite,
        0,
        timeAxis,
        seedFrame,
        seedsFromNeighbour);
  }

  Path in() {
    return Path.of(in);
  }

  String modelSha256() {
    return modelSha256;
  }

  DisplayRange[] ranges() {
    if (ranges == null) {
      return null;
    }
    DisplayRange[] r = new DisplayRange[ranges.length / 2];
    for (int c = 0; c < r.length; c++) {
      r[c] = new DisplayRange(ranges[2 * c], ranges[2 * c + 1]);
    }
    return r;
  }

  /**
   * Parses the model from the bytes this value carries (not from the model path, which may not be
   * readable where this runs).
   */
  SegmentationModel parseModel() {
    return ModelFiles.parse(modelJson, model);
  }
}
