package io.github.cleave.synth;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;

/**
 * Invented microscope-like images with known ground truth, for tests and demos: generated here from
 * a seed and a size, never taken from real specimens. All pixel arithmetic is in {@code double}
 * with {@link StrictMath} and one {@link SplittableRandom} per call, so a (recipe, seed, size)
 * always gives the same pixels, bit for bit.
 *
 * <p>Every recipe places nuclei with {@link NucleusLayout} (ellipses or ellipsoids of varying size
 * and brightness, several touching pairs), and is made deliberately hard for one global threshold:
 * a strong illumination ramp with vignetting (the brightest background is brighter than the dimmest
 * nuclei), per-nucleus brightness varying by a factor of about two, and blur; yet every nucleus is
 * several noise levels brighter (or darker) than the background right around it. The measured
 * difficulty: Otsu's global threshold reaches a Dice coefficient of at most 0.85 against the truth
 * on each default phantom ({@code SamplePhantomsTest} holds the numbers).
 *
 * <ol>
 *   <li>{@link #nuclei}: 16-bit fluorescence. Emission = illumination × (40 + 300 · g · (1 + 0.25 ·
 *       texture)) photons in nuclei, 40 elsewhere (g uniform in [0.35, 1.3] per nucleus, texture a
 *       smooth random field, σ = 1.5 px), plus out-of-focus haze: a Gaussian bump of 60 photons, σ
 *       = 0.2 of the image side, at a random place; illumination a ramp from 0.15 to 1 at a random
 *       angle times (1 − 0.3 r²), r the distance from the centre over the half diagonal; Gaussian
 *       PSF σ = 1.3 px; camera: Poisson counts × 2 ADU + 100 ADU offset + Gaussian read noise σ = 3
 *       ADU. Pixel 0.325 µm.
 *   <li>{@link #stained}: RGB brightfield-like section by the Beer–Lambert law: transmitted light =
 *       255 · illumination · exp(−(c_n · a_n + c_p · a_p)) per channel, with an invented purple
 *       stain (absorbance a_n = 0.60, 0.75, 0.25 for R, G, B; c_n = 1.6 · g · (1 + 0.2 texture) in
 *       nuclei, g in [0.8, 1.25]) and an invented pink stain (a_p = 0.08, 0.85, 0.25; c_p = 0.2 +
 *       0.45 · fibres everywhere, fibres a wavy streaked texture); illumination a ramp from 0.6 to
 *       1 times (1 − 0.25 r²); stains blurred with σ = 1 px; Gaussian noise σ = 3 grey levels;
 *       rounded to 0..255. Pixel 0.25 µm.
 *   <li>{@link #twoChannel}: channel 1 as {@link #nuclei} but with a ramp from 0.12, fall-off 0.35
 *       and haze of 90 photons (σ = 0.25 of the side); channel 2 a second marker in a ring around
 *       each nucleus (normalised radius 1.1 to 1.7, outside all nuclei), its level per nucleus 0
 *       (probability 1/4) or uniform in [0.2, 1] · 120 photons, on 15 photons of background, same
 *       illumination, PSF and camera.
 *   <li>{@link #stack}: 16-bit 3D, voxel 0.2 × 0.2 × 0.6 µm; ellipsoids with z semi-axis 0.5 of the
 *       mean xy semi-axis in voxels (flattened nuclei); illumination a ramp from 0.2 to 1 times (1
 *       − 0.25 r²) times a depth attenuation falling linearly to 0.5 at the last plane; haze of 18
 *       photons (σ = 0.25 of the side, every plane); PSF σ = 1.0, 1.0, 1.0 voxels (about 0.2, 0.2,
 *       0.6 µm: three times wider in z); same emission and camera as {@link #nuclei}. (An earlier
 *       recipe had z semi-axes of 0.4 and σ = 1.5 planes: even the noise-free half-maximum surface
 *       of its objects agreed with the truth at Dice 0.95 only, so no segmentation could be judged
 *       against a goal of 0.95; {@code SamplePhantomsTest} now requires 0.97 of every recipe.)
 * </ol>
 *
 * <p>Seeds come from {@link StrokeGenerator#strokes} with the seed {@code seed + 1}. Stateless,
 * thread-safe.
 */
public final class SamplePhantoms {
  /** Seed of the bundled sample images. */
  public static final long DEFAULT_SEED = 20261202L;

  private static final String MICRON = "\u00b5m";

  /** Fluorescence recipes: background emission, in photons at full illumination. */
  private static final double BACKGROUND = 40;

  /** Fluorescence recipes: nucleus emission at relative brightness 1, photons. */
  private static final double NUCLEUS = 300;

  /** Fluorescence recipes: peak of the additive out-of-focus haze, photons. */
  private static final double HAZE = 60;

  private SamplePhantoms() {}

  /** The four recipes at their default sizes: nuclei, stained, two-channel, stack. */
  public static List<Phantom> all(long seed) {
    return List.of(
        nuclei(seed, 512, 512),
        stained(seed, 384, 384),
        twoChannel(seed, 256, 256),
        stack(seed, 128, 128, 32));
  }

  /**
   * Fluorescent nuclei, 16-bit grey: about one nucleus per 6000 pixels and one touching pair per 50
   * 000 pixels (512 × 512: 43 singles, 5 pairs).
   *
   * @throws IllegalArgumentException if the image is smaller than 96 × 96
   */
  public static Phantom nuclei(long seed, int width, int height) {
    return nuclei(seed, width, height, false);
  }

  /**
   * {@link #nuclei} as a flat-field-corrected camera would record it: the same nuclei, texture,
   * haze and noise recipe, the illumination 1 everywhere (the ramp's random angle is still drawn,
   * so the nuclei are those of {@code nuclei(seed, width, height)}). The usual input of
   * high-content screens, whose acquisition corrects the illumination; for benchmarks of folder
   * runs.
   *
   * @throws IllegalArgumentException if the image is smaller than 96 × 96
   */
  public static Phantom nucleiEvenlyLit(long seed, int width, int height) {
    return nuclei(seed, width, height, true);
  }

  private static Phantom nuclei(long seed, int width, int height, boolean evenlyLit) {
    checkSize(width, height, 96);
    SplittableRandom random = new SplittableRandom(seed);
    int area = width * height;
    NucleusLayout layout =
        NucleusLayout.place(
            random, width, height, 1, area / 6000, Math.max(2, area / 50000), 8, 15, 0, 0.35, 1.3);
    double angle = random.nextDouble() * 2 * Math.PI; // drawn either way: the same layout after it
    double[] illumination = new double[width * height];
    if (evenlyLit) {
      Arrays.fill(illumination, 1.0);
    } else {
      illumination = Fields.illumination(width, height, angle, 0.15, 0.3);
    }
    int[] labels = layout.labels(width, height, 1, null);
    double[] texture = Fields.texture(random, width, height, 1, 1.5, 1.5, 0);
    double[] haze = scaled(Fields.haze(random, width, height, 0.2), HAZE);
    float[] pixels =
        fluorescence(random, layout, labels, texture, illumination, haze, width, height, 1, 1.3, 0);
    Raster image =
        Raster.grey(
            width,
            height,
            1,
            pixels,
            new VoxelSize(0.325, 0.325, 1, MICRON, false),
            PixelKind.GREY16);
    return assemble(evenlyLit ? "nuclei-even" : "nuclei", image, labels, layout, 0, pixels, seed);
  }

  /**
   * Stained-section-like RGB image: dark purple-blue nuclei on a pink, fibrous background, about
   * one nucleus per 4500 pixels and one touching pair per 40 000 pixels.
   *
   * @throws IllegalArgumentException if the image is smaller than 96 × 96
   */
  public static Phantom stained(long seed, int width, int height) {
    checkSize(width, height, 96);
    SplittableRandom random = new SplittableRandom(seed);
    int area = width * height;
    NucleusLayout layout =
        NucleusLayout.place(
            random, width, height, 1, area / 4500, Math.max(2, area / 40000), 7, 13, 0, 0.8, 1.25);
    double[] illumination =
        Fields.illumination(width, height, random.nextDouble() * 2 * Math.PI, 0.6, 0.25);
    int[] labels = layout.labels(width, height, 1, null);
    double[] chromatin = Fields.texture(random, width, height, 1, 1.2, 1.2, 0);
    double[] streaks = Fields.texture(random, width, height, 1, 9, 0.8, 0);
    double[] nuclear = new double[area];
    double[] pink = new double[area];
    double waveAngle = random.nextDouble() * Math.PI;
    for (int y = 0; y < height; y++) {
      for (int x = 0; x < width; x++) {
        int i = x + width * y;
        int k = labels[i];
        if (k > 0) {
          nuclear[i] = 1.6 * layout.blobs.get(k - 1).gain() * (1 + 0.2 * chromatin[i]);
        }
        // wavy fibres: the streak field sampled along rows displaced by a slow sine
        int sy =
            (int)
                Math.floorMod(
                    (long) Math.rint(y + 5 * StrictMath.sin(x / 23.0 + waveAngle)), height);
        double fibre = Math.max(0, Math.min(1, 0.5 + 0.35 * streaks[x + width * sy]));
        pink[i] = 0.2 + 0.45 * fibre;
      }
    }
    nuclear = Fields.blur(nuclear, width, height, 1, 1, 1, 0);
    pink = Fields.blur(pink, width, height, 1, 1, 1, 0);
    double[][] absorbance = {{0.60, 0.75, 0.25}, {0.08, 0.85, 0.25}};
    float[][] rgb = new float[3][area];
    for (int i = 0; i < area; i++) {
      for (int c = 0; c < 3; c++) {
        double light =
            255
                * illumination[i]
                * StrictMath.exp(-(nuclear[i] * absorbance[0][c] + pink[i] * absorbance[1][c]));
        rgb[c][i] =
            (float) Math.min(255, Math.max(0, Math.rint(light + 3 * Randoms.gaussian(random))));
      }
    }
    Raster image =
        new Raster(
            width, height, 1, rgb, new VoxelSize(0.25, 0.25, 1, MICRON, false), PixelKind.RGB);
    float[] brightness = new float[area];
    for (int i = 0; i < area; i++) {
      brightness[i] = (rgb[0][i] + rgb[1][i] + rgb[2][i]) / 3;
    }
    return assemble("stained", image, labels, layout, 0, brightness, seed);
  }

  /**
   * Two 16-bit channels: nuclei (channel 1, segmented) and a ring marker around them (channel 2,
   * measured); about one nucleus per 5000 pixels and one touching pair per 30 000 pixels.
   *
   * @throws IllegalArgumentException if the image is smaller than 96 × 96
   */
  public static Phantom twoChannel(long seed, int width, int height) {
    checkSize(width, height, 96);
    SplittableRandom random = new SplittableRandom(seed);
    int area = width * height;
    NucleusLayout layout =
        NucleusLayout.place(
            random, width, height, 1, area / 5000, Math.max(2, area / 30000), 7, 13, 0, 0.35, 1.3);
    double[] illumination =
        Fields.illumination(width, height, random.nextDouble() * 2 * Math.PI, 0.12, 0.35);
    int[] labels = layout.labels(width, height, 1, null);
    double[] texture = Fields.texture(random, width, height, 1, 1.5, 1.5, 0);
    double[] haze = scaled(Fields.haze(random, width, height, 0.25), 1.5 * HAZE);
    float[] nuclei =
        fluorescence(random, layout, labels, texture, illumination, haze, width, height, 1, 1.3, 0);
    double[] level = new double[layout.blobs.size()];
    for (int k = 0; k < level.length; k++) {
      level[k] = random.nextDouble() < 0.25 ? 0 : 120 * (0.2 + 0.8 * random.nextDouble());
    }
    double[] marker = new double[area];
    for (int y = 0; y < height; y++) {
      for (int x = 0; x < width; x++) {
        int i = x + width * y;
        if (labels[i] != 0) {
          continue;
        }
        for (int k = 0; k < level.length; k++) {
          double q = layout.blobs.get(k).radius2(x, y, 0);
          if (q >= 1.1 * 1.1 && q < 1.7 * 1.7) {
            marker[i] = Math.max(marker[i], level[k]);
          }
        }
      }
    }
    double[] photons = Fields.blur(marker, width, height, 1, 1.3, 1.3, 0);
    for (int i = 0; i < area; i++) {
      photons[i] = illumination[i] * (15 + photons[i]);
    }
    float[] ring = Randoms.camera16(random, photons, 100, 2, 3);
    Raster image =
        new Raster(
            width,
            height,
            1,
            new float[][] {nuclei, ring},
            new VoxelSize(0.325, 0.325, 1, MICRON, false),
            PixelKind.GREY16);
    return assemble("two-channel", image, labels, layout, 0, nuclei, seed);
  }

  /**
   * A 16-bit z-stack of flattened nuclei, voxel 0.2 × 0.2 × 0.6 µm; about one nucleus per 2000
   * pixels of a plane and one touching pair per 8000.
   *
   * @throws IllegalArgumentException if a plane is smaller than 64 × 64 or there are fewer than 12
   *     planes
   */
  public static Phantom stack(long seed, int width, int height, int depth) {
    checkSize(width, height, 64);
    if (depth < 12) {
      throw new IllegalArgumentException("stack depth " + depth + ": use at least 12 planes");
    }
    SplittableRandom random = new SplittableRandom(seed);
    int area = width * height;
    NucleusLayout layout =
        NucleusLayout.place(
            random,
            width,
            height,
            depth,
            area / 2000,
            Math.max(1, area / 8000),
            8,
            13,
            0.5,
            0.5,
            1.3);
    double[] plane =
        Fields.illumination(width, height, random.nextDouble() * 2 * Math.PI, 0.2, 0.25);
    double[] illumination = new double[area * depth];
    for (int z = 0; z < depth; z++) {
      double attenuation = 1 - 0.5 * z / (depth - 1.0);
      for (int i = 0; i < area; i++) {
        illumination[i + area * z] = plane[i] * attenuation;
      }
    }
    int[] labels = layout.labels(width, height, depth, null);
    double[] texture = Fields.texture(random, width, height, depth, 1.5, 1.5, 0.5);
    double[] hazePlane = scaled(Fields.haze(random, width, height, 0.25), 0.3 * HAZE);
    double[] haze = new double[area * depth];
    for (int z = 0; z < depth; z++) {
      System.arraycopy(hazePlane, 0, haze, area * z, area);
    }
    float[] pixels =
        fluorescence(
            random, layout, labels, texture, illumination, haze, width, height, depth, 1.0, 1.0);
    Raster image =
        Raster.grey(
            width,
            height,
            depth,
            pixels,
            new VoxelSize(0.2, 0.2, 0.6, MICRON, false),
            PixelKind.GREY16);
    return assemble("stack", image, labels, layout, 0, pixels, seed);
  }

  /** Emission, PSF and camera shared by the fluorescence recipes. */
  private static float[] fluorescence(
      SplittableRandom random,
      NucleusLayout layout,
      int[] labels,
      double[] texture,
      double[] illumination,
      double[] haze,
      int w,
      int h,
      int d,
      double sxy,
      double sz) {
    double[] emission = new double[labels.length];
    for (int i = 0; i < labels.length; i++) {
      int k = labels[i];
      double signal =
          k > 0 ? NUCLEUS * layout.blobs.get(k - 1).gain() * (1 + 0.25 * texture[i]) : 0;
      emission[i] = illumination[i] * (BACKGROUND + Math.max(0, signal)) + haze[i];
    }
    double[] photons = Fields.blur(emission, w, h, d, sxy, sxy, sz);
    return Randoms.camera16(random, photons, 100, 2, 3);
  }

  private static Phantom assemble(
      String name,
      Raster image,
      int[] labels,
      NucleusLayout layout,
      int channel,
      float[] brightness,
      long seed) {
    byte[] truth = new byte[labels.length];
    for (int i = 0; i < labels.length; i++) {
      truth[i] = (byte) (labels[i] != 0 ? 1 : 0);
    }
    SeedLabels seeds =
        StrokeGenerator.strokes(
            labels, brightness, image.width(), image.height(), image.depth(), seed + 1);
    return new Phantom(
        name, image, truth, labels, seeds, layout.blobs.size(), layout.pairs, channel);
  }

  private static double[] scaled(double[] field, double factor) {
    for (int i = 0; i < field.length; i++) {
      field[i] *= factor;
    }
    return field;
  }

  private static void checkSize(int width, int height, int min) {
    if (width < min || height < min) {
      throw new IllegalArgumentException(
          "image size " + width + " x " + height + ": use at least " + min + " x " + min);
    }
  }
}
