package io.github.cleave.segment;

import io.github.cleave.image.VoxelSize;
import io.github.cleave.objects.ObjectLabels;
import io.github.cleave.objects.ObjectMeasurement;
import java.util.List;

/**
 * The result of one segmentation, the same whichever front door asked for it. Immutable by
 * convention: the mask array is shared, do not modify it.
 *
 * @param mask the foreground, 255 / 0 in the image's voxel order: the union of the kept objects
 *     (the cut without specks, holes filled, filtered objects removed; see {@code MaskCleaning})
 * @param objects the object label image made from the mask (split, filtered, numbered)
 * @param measurements one entry per object, in object-number order
 * @param energy the minimum energy in nats of the last global cut (its flow value over {@link
 *     io.github.cleave.energy.CapacityScale#UNITS_PER_NAT}); edge placement and speck removal
 *     change the mask after that cut, not this value
 * @param flowValue the maximum flow of the last global cut in capacity units, equal to its cut
 *     value
 * @param model the model applied (learned from this image's seeds, or loaded)
 * @param voxelSize the calibration used for measurements ({@code assumed} when the file had none)
 * @param timings per-phase wall-clock times
 * @param warnings things the user should know (assumed calibration, calibration differing from the
 *     model's, flattening decisions)
 * @param classes the classes of a segmentation into three or more classes, {@code null} for
 *     foreground against background; when present, the mask is every kept object of every class but
 *     the background, the energy and flow value are those of the Potts energy's minimum found
 *     (there is no single cut), and each object's class is {@link ClassMap#classOf}
 */
public record Segmentation(
    byte[] mask,
    ObjectLabels objects,
    List<ObjectMeasurement> measurements,
    double energy,
    long flowValue,
    SegmentationModel model,
    VoxelSize voxelSize,
    PhaseTimings timings,
    List<String> warnings,
    ClassMap classes) {

  public Segmentation {
    measurements = List.copyOf(measurements);
    warnings = List.copyOf(warnings);
  }

  /** Whether this is a segmentation into three or more classes ({@link #classes} present). */
  public boolean isMultiClass() {
    return classes != null;
  }

  /** The number of foreground voxels. */
  public int foregroundCount() {
    int n = 0;
    for (byte b : mask) {
      if (b != 0) {
        n++;
      }
    }
    return n;
  }
}
