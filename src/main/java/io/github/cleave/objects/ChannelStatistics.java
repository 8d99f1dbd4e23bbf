package io.github.cleave.objects;

/**
 * Intensity of one channel over one object, from raw pixel values (never display-scaled).
 *
 * @param channel the channel measured, 0-based
 * @param mean mean raw value over the object's voxels
 * @param min smallest raw value
 * @param max largest raw value
 * @param rawIntegratedDensity sum of the raw values (ImageJ's "RawIntDen")
 * @param integratedDensity sum of the raw values times the pixel area (single plane, value·unit²)
 *     or the voxel volume (stack, value·unit³), i.e. mean × area or mean × volume (ImageJ's
 *     "IntDen" for a plane)
 */
public record ChannelStatistics(
    int channel,
    double mean,
    double min,
    double max,
    double rawIntegratedDensity,
    double integratedDensity) {}
