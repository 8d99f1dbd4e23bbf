package io.github.cleave.objects;

import java.util.List;

/**
 * Measurements of one object, in calibrated units unless named otherwise. Immutable value type.
 *
 * @param label the object number (as in the label image and the ROI zip)
 * @param voxelCount number of pixels or voxels
 * @param areaOrVolume {@code voxelCount} times the pixel area (unit², single plane) or the voxel
 *     volume (unit³, stack)
 * @param centroidX mean of the voxel centres {@code (x + 0.5)·sizeX} (ImageJ's pixel-centre
 *     convention)
 * @param centroidY likewise {@code (y + 0.5)·sizeY}
 * @param centroidZ likewise {@code (z + 0.5)·sizeZ} in a stack; 0 for a single plane
 * @param boxX first column of the bounding box, in pixels
 * @param boxY first row, in pixels
 * @param boxZ first plane, 0-based
 * @param boxWidth bounding box width, in pixels
 * @param boxHeight bounding box height, in pixels
 * @param boxDepth bounding box depth, in planes
 * @param perimeterOrSurface Cauchy–Crofton estimate of the boundary length (unit, single plane) or
 *     surface area (unit², stack); see {@link ObjectMeasurements}
 * @param channels intensity statistics of the measured channels, in the order requested
 */
public record ObjectMeasurement(
    int label,
    long voxelCount,
    double areaOrVolume,
    double centroidX,
    double centroidY,
    double centroidZ,
    int boxX,
    int boxY,
    int boxZ,
    int boxWidth,
    int boxHeight,
    int boxDepth,
    double perimeterOrSurface,
    List<ChannelStatistics> channels) {

  /** Copies {@code channels} into an unmodifiable list. */
  public ObjectMeasurement {
    channels = List.copyOf(channels);
  }
}
