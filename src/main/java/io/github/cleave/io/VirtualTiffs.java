package io.github.cleave.io;

import ij.ImagePlus;
import ij.io.FileInfo;
import ij.io.FileOpener;
import ij.plugin.FileInfoVirtualStack;
import java.nio.file.Path;
import java.util.Properties;

/**
 * Opens a TIFF as an ImageJ virtual stack ({@code ij.plugin.FileInfoVirtualStack} over one image
 * entry per plane), so that each plane is read from the file only when the stack is asked for it.
 *
 * <p>Built here rather than with ImageJ's own "open virtual" entry point, which renames the first
 * plane's entry after the {@code name=} line that ImageJ's TIFF writer puts in the description (the
 * image's title when it was saved), so that the first plane of a file whose name differs from that
 * title (every output of ours, any renamed file) is read from a file that does not exist and comes
 * back as zeros. Here the description is decoded on copies only. Planes are split as ImageJ splits
 * a contiguous stack: one entry with {@code nImages} planes becomes one entry per plane at offset
 * {@code offset + i * (planeBytes + gap)}.
 */
final class VirtualTiffs {
  private VirtualTiffs() {}

  /**
   * The image of {@code infos} (the checked header of {@code file}), virtual, with ImageJ's
   * dimensions, calibration, description and info; or null when ImageJ's virtual stacks cannot hold
   * this kind of file (48-bit RGB), which the caller then reads whole.
   */
  static ImagePlus open(Path file, FileInfo[] infos) {
    FileInfo first = infos[0];
    if (first.fileType == FileInfo.RGB48 || first.fileType == FileInfo.RGB48_PLANAR) {
      return null;
    }
    FileInfo[] planes;
    if (infos.length == 1 && first.nImages > 1) {
      long planeBytes = (long) first.width * first.height * first.getBytesPerPixel();
      if (first.fileType == FileInfo.GRAY12_UNSIGNED) {
        planeBytes = (long) (int) (1.5 * first.width) * first.height;
      }
      planes = new FileInfo[first.nImages];
      for (int i = 0; i < planes.length; i++) {
        planes[i] = (FileInfo) first.clone();
        planes[i].nImages = 1;
        planes[i].longOffset = first.getOffset() + i * (planeBytes + first.getGap());
      }
    } else {
      planes = new FileInfo[infos.length];
      for (int i = 0; i < infos.length; i++) {
        planes[i] = (FileInfo) infos[i].clone();
        planes[i].nImages = 1;
      }
    }
    // Calibration, LUT and info as ImageJ opens a single plane; on a copy that may be renamed.
    FileInfo probe = (FileInfo) planes[0].clone();
    ImagePlus plane = new FileOpener(probe).openImage();
    if (plane == null) {
      return null;
    }
    FileInfoVirtualStack stack = new FileInfoVirtualStack(planes);
    stack.setBitDepth(plane.getBitDepth());
    ImagePlus imp = new ImagePlus(file.getFileName().toString(), stack);
    imp.setCalibration(plane.getCalibration());
    imp.setFileInfo((FileInfo) first.clone());
    if (first.info != null) {
      imp.setProperty("Info", first.info);
    }
    FileInfo described = (FileInfo) first.clone();
    Properties props = new FileOpener(described).decodeDescriptionString(described);
    if (props != null) {
      int channels = intOf(props, "channels");
      int slices = intOf(props, "slices");
      int frames = intOf(props, "frames");
      if ((long) channels * slices * frames == planes.length) {
        imp.setDimensions(channels, slices, frames);
      }
    }
    return imp;
  }

  private static int intOf(Properties props, String key) {
    String s = props.getProperty(key);
    if (s == null) {
      return 1;
    }
    try {
      int v = (int) Double.parseDouble(s.strip());
      return v < 1 ? 1 : v;
    } catch (NumberFormatException e) {
      return 1;
    }
  }
}
