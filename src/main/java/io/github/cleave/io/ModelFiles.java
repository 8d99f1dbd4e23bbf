package io.github.cleave.io;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParseException;
import com.google.gson.JsonParser;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.LikelihoodModel;
import io.github.cleave.model.ModelKind;
import io.github.cleave.objects.ObjectSettings;
import io.github.cleave.objects.ObjectSplit;
import io.github.cleave.segment.IlluminationMode;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.SegmentationSettings;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;

/**
 * Model files: a {@link SegmentationModel} as JSON (DESIGN.md): {@code "format": "cleave-model"},
 * the format version, the software version, every setting, the values resolved while learning, and
 * the learned likelihood model. Written atomically with the keys in a fixed order, so the same
 * model always gives the same bytes. Reading a file of a newer format version, or a damaged or
 * foreign file, fails with a {@link BadInputException} that names the file and the field.
 */
public final class ModelFiles {
  /** The value of the {@code format} field. */
  public static final String FORMAT = "cleave-model";

  private static final Gson GSON =
      new GsonBuilder().setPrettyPrinting().serializeSpecialFloatingPointValues().create();

  private ModelFiles() {}

  /** Writes {@code model} to {@code file} atomically. */
  public static void write(Path file, SegmentationModel model) throws IOException {
    byte[] bytes = (GSON.toJson(toJson(model)) + "\n").getBytes(StandardCharsets.UTF_8);
    AtomicFiles.write(file, out -> out.write(bytes));
  }

  /**
   * Reads a model file.
   *
   * @throws BadInputException if the file is missing, not JSON, of a newer format, or damaged
   */
  public static SegmentationModel read(Path file) {
    return parse(bytes(file), file.toString());
  }

  /**
   * The bytes of a model file, for checksums and for sending the model to other machines.
   *
   * @throws BadInputException if the file is missing or cannot be read
   */
  public static byte[] bytes(Path file) {
    try {
      return Files.readAllBytes(file);
    } catch (NoSuchFileException e) {
      throw new BadInputException("model file " + file + " does not exist");
    } catch (IOException e) {
      throw new BadInputException(
          "model file " + file + " cannot be read (" + e.getMessage() + ")", e);
    }
  }

  /**
   * A model from the bytes of a model file; {@code file} names it in messages.
   *
   * @throws BadInputException if the bytes are not JSON, of a newer format, or damaged
   */
  public static SegmentationModel parse(byte[] json, String file) {
    JsonElement root;
    try (Reader r = new InputStreamReader(new ByteArrayInputStream(json), StandardCharsets.UTF_8)) {
      root = JsonParser.parseReader(r);
    } catch (IOException | JsonParseException e) {
      throw new BadInputException(
          "model file " + file + " is not readable JSON (" + e.getMessage() + ")", e);
    }
    if (!root.isJsonObject()) {
      throw new BadInputException("model file " + file + " is not a Cleave model (no JSON object)");
    }
    JsonFields f = new JsonFields(root.getAsJsonObject(), "model file " + file);
    if (!f.has("format") || !FORMAT.equals(f.string("format"))) {
      throw new BadInputException(
          "model file " + file + " is not a Cleave model (no \"format\": \"" + FORMAT + "\")");
    }
    int version = f.integer("formatVersion");
    if (version < 1) {
      throw f.wrong("formatVersion", "a version number of 1 or more");
    }
    if (version > SegmentationModel.FORMAT_VERSION) {
      throw new BadInputException(
          "model file "
              + file
              + " has format version "
              + version
              + ", newer than this Cleave reads ("
              + SegmentationModel.FORMAT_VERSION
              + "): update Cleave");
    }
    try {
      return fromJson(f);
    } catch (IllegalArgumentException e) {
      throw new BadInputException("model file " + file + ": " + e.getMessage(), e);
    }
  }

  static JsonObject toJson(SegmentationModel m) {
    JsonObject o = new JsonObject();
    o.addProperty("format", FORMAT);
    o.addProperty("formatVersion", SegmentationModel.FORMAT_VERSION);
    o.addProperty("software", m.softwareVersion());
    o.add("settings", settingsToJson(m.settings()));
    o.addProperty("contrastScale", m.contrastScale());
    o.addProperty("flattenIllumination", m.flatten());
    o.addProperty("lightBackground", m.lightBackground());
    o.addProperty("imageChannels", m.imageChannels());
    o.addProperty("pixelKind", m.pixelKind().name());
    o.add("voxelSize", voxelSizeToJson(m.voxelSize()));
    o.add("likelihood", LikelihoodModelJson.toJson(m.likelihood()));
    o.addProperty("likelihoodRefined", m.likelihoodRefined());
    return o;
  }

  private static SegmentationModel fromJson(JsonFields f) {
    LikelihoodModel likelihood = LikelihoodModelJson.fromJson(f.object("likelihood").raw());
    return new SegmentationModel(
        likelihood,
        settingsFromJson(f.object("settings")),
        f.number("contrastScale"),
        f.bool("flattenIllumination"),
        f.bool("lightBackground"),
        f.integer("imageChannels"),
        enumValue(PixelKind.class, f, "pixelKind"),
        voxelSizeFromJson(f.object("voxelSize")),
        f.string("software"),
        f.has("likelihoodRefined") && f.bool("likelihoodRefined"));
  }

  /** The settings as JSON; also used by the run record. */
  public static JsonObject settingsToJson(SegmentationSettings s) {
    JsonObject o = new JsonObject();
    o.addProperty("boundaryPenalty", s.boundaryPenalty());
    if (Double.isNaN(s.contrastScale())) {
      o.addProperty("contrastScale", "auto");
    } else {
      o.addProperty("contrastScale", s.contrastScale());
    }
    o.addProperty("neighborhood", s.neighborhood());
    o.addProperty("likelihood", s.modelKind().name());
    o.addProperty("refinementRounds", s.refinementRounds());
    o.add("drivingChannels", oneBased(s.drivingChannels()));
    o.add("measuredChannels", oneBased(s.measuredChannels()));
    o.addProperty("illumination", s.illumination().name());
    o.addProperty("flattenRadiusPixels", s.flattenRadius());
    o.addProperty("perPlane", s.perPlane());
    if (s.assumedVoxelSize() != null) {
      o.add("assumedVoxelSize", voxelSizeToJson(s.assumedVoxelSize()));
    }
    ObjectSettings objects = s.objects();
    JsonObject ob = new JsonObject();
    ob.addProperty("fillHoles", objects.fillHoles());
    ob.addProperty("split", objects.split().name());
    ob.addProperty("minSize", objects.minSize());
    if (Double.isFinite(objects.maxSize())) {
      ob.addProperty("maxSize", objects.maxSize());
    }
    ob.addProperty("excludeEdges", objects.excludeEdges());
    ob.addProperty("excludeEdgePlanes", objects.excludeEdgePlanes());
    o.add("objects", ob);
    return o;
  }

  private static SegmentationSettings settingsFromJson(JsonFields f) {
    boolean auto =
        f.raw().get("contrastScale") != null
            && f.raw().get("contrastScale").isJsonPrimitive()
            && f.raw().getAsJsonPrimitive("contrastScale").isString();
    if (auto && !"auto".equals(f.string("contrastScale"))) {
      throw f.wrong("contrastScale", "a number or \"auto\"");
    }
    double sigma = auto ? Double.NaN : f.number("contrastScale");
    JsonFields ob = f.object("objects");
    return new SegmentationSettings(
        f.number("boundaryPenalty"),
        sigma,
        f.integer("neighborhood"),
        enumValue(ModelKind.class, f, "likelihood"),
        f.integer("refinementRounds"),
        zeroBased(f.integersOrNull("drivingChannels")),
        zeroBased(f.integersOrNull("measuredChannels")),
        enumValue(IlluminationMode.class, f, "illumination"),
        f.number("flattenRadiusPixels"),
        f.bool("perPlane"),
        f.has("assumedVoxelSize") ? voxelSizeFromJson(f.object("assumedVoxelSize")) : null,
        new ObjectSettings(
            ob.bool("fillHoles"),
            enumValue(ObjectSplit.class, ob, "split"),
            ob.number("minSize"),
            ob.numberOr("maxSize", Double.POSITIVE_INFINITY),
            ob.bool("excludeEdges"),
            ob.bool("excludeEdgePlanes")));
  }

  /** A voxel size as JSON; also used by the run record. */
  public static JsonObject voxelSizeToJson(VoxelSize v) {
    JsonObject o = new JsonObject();
    o.addProperty("x", v.x());
    o.addProperty("y", v.y());
    o.addProperty("z", v.z());
    o.addProperty("unit", v.unit());
    o.addProperty("assumed", v.assumed());
    return o;
  }

  private static VoxelSize voxelSizeFromJson(JsonFields f) {
    return new VoxelSize(
        f.number("x"), f.number("y"), f.number("z"), f.string("unit"), f.bool("assumed"));
  }

  private static <E extends Enum<E>> E enumValue(Class<E> type, JsonFields f, String name) {
    String v = f.string(name);
    try {
      return Enum.valueOf(type, v);
    } catch (IllegalArgumentException e) {
      throw f.wrong(name, "one of " + java.util.Arrays.toString(type.getEnumConstants()));
    }
  }

  private static JsonElement oneBased(int[] channels) {
    if (channels == null) {
      return com.google.gson.JsonNull.INSTANCE;
    }
    JsonArray a = new JsonArray();
    for (int c : channels) {
      a.add(c + 1);
    }
    return a;
  }

  private static int[] zeroBased(int[] channels) {
    if (channels == null) {
      return null;
    }
    int[] out = new int[channels.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = channels[i] - 1;
    }
    return out;
  }
}
