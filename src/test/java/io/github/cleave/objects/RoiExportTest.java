package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;

import ij.gui.Roi;
import ij.process.ImageProcessor;
import java.awt.Rectangle;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class RoiExportTest {

  /** Pixels of a ROI, as indices of a w-wide plane, by ImageJ's own mask of the ROI. */
  private static boolean[] pixels(Roi roi, int w, int h) {
    boolean[] in = new boolean[w * h];
    Rectangle b = roi.getBounds();
    ImageProcessor m = roi.getMask(); // null for a rectangle: every pixel of the bounds
    for (int y = b.y; y < b.y + b.height; y++) {
      for (int x = b.x; x < b.x + b.width; x++) {
        if (m == null || m.get(x - b.x, y - b.y) != 0) {
          assertThat(x >= 0 && y >= 0 && x < w && y < h).isTrue();
          in[x + w * y] = true;
        }
      }
    }
    return in;
  }

  private static ObjectLabels randomObjects(SplittableRandom rnd, int w, int h, int d) {
    byte[] mask = new byte[w * h * d];
    for (int k = 0; k < 6; k++) {
      if (d == 1) {
        Phantoms.disk(mask, w, h, 1, 1, rnd.nextDouble(w), rnd.nextDouble(h), rnd.nextDouble(1, 8));
      } else {
        Phantoms.ball(
            mask,
            w,
            h,
            d,
            1,
            1,
            2,
            rnd.nextDouble(w),
            rnd.nextDouble(h),
            rnd.nextDouble(2 * d),
            rnd.nextDouble(1, 6));
      }
    }
    // holes, isolated pixels and ragged parts
    for (int i = 0; i < mask.length; i++) {
      double u = rnd.nextDouble();
      if (u < 0.03) {
        mask[i] = 0;
      } else if (u < 0.05) {
        mask[i] = 1;
      }
    }
    return ConnectedComponents.of(mask, w, h, d);
  }

  @Test
  void zipDecodesToTheObjectsPixelsPlaneByPlane() throws Exception {
    SplittableRandom rnd = new SplittableRandom(51);
    for (int t = 0; t < 12; t++) {
      int w = 10 + rnd.nextInt(40);
      int h = 10 + rnd.nextInt(40);
      int d = t % 2 == 0 ? 1 : 2 + rnd.nextInt(5);
      ObjectLabels labels = randomObjects(rnd, w, h, d);
      byte[] zip = RoiExport.roiZip(labels);
      assertThat(RoiExport.roiZip(labels)).isEqualTo(zip); // deterministic bytes
      Map<String, Roi> rois = RoiExport.readZip(zip);

      List<String> expectedNames = new ArrayList<>();
      for (int l = 1; l <= labels.count(); l++) {
        for (int z = 0; z < d; z++) {
          boolean[] truth = new boolean[w * h];
          boolean any = false;
          for (int i = 0; i < w * h; i++) {
            truth[i] = labels.labelAt(i + w * h * z) == l;
            any |= truth[i];
          }
          if (!any) {
            continue;
          }
          String name =
              String.format("object-%04d", l) + (d > 1 ? String.format("-z%04d", z + 1) : "");
          expectedNames.add(name);
          Roi roi = rois.get(name);
          assertThat(roi).as(name).isNotNull();
          assertThat(roi.getName()).isEqualTo(name);
          if (d > 1) {
            assertThat(roi.getPosition()).isEqualTo(z + 1);
          }
          assertThat(pixels(roi, w, h)).as("trial %d %s", t, name).isEqualTo(truth);
        }
      }
      assertThat(rois.keySet()).containsExactlyElementsOf(expectedNames);
    }
  }

  @Test
  void ringKeepsItsHoleAndSeparatePartsStayTogether() throws Exception {
    int w = 30;
    byte[] ring = new byte[w * w];
    Phantoms.disk(ring, w, w, 1, 1, 15, 15, 10);
    byte[] hole = new byte[w * w];
    Phantoms.disk(hole, w, w, 1, 1, 15, 15, 4);
    int[] labels = new int[w * w];
    for (int i = 0; i < labels.length; i++) {
      labels[i] = ring[i] != 0 && hole[i] == 0 ? 1 : 0;
    }
    labels[0] = 1; // a detached corner pixel of the same object
    ObjectLabels objects = ObjectLabels.renumbered(w, w, 1, labels);
    Roi roi = RoiExport.readZip(RoiExport.roiZip(objects)).get("object-0001");
    boolean[] in = pixels(roi, w, w);
    assertThat(in[0]).isTrue();
    assertThat(in[15 + w * 15]).isFalse(); // the hole survives
    assertThat(in[15 + w * 8]).isTrue();
  }
}
