package io.github.cleave.spark;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.function.UnaryOperator;

/**
 * Replaces the local paths that a staged run's JSON files name (the copies on a worker's or the
 * driver's disk) by the paths of the files the user named ({@code hdfs://...}): in a file's record
 * the image, seeds and model paths; in {@code run.started.json} the model; in {@code run.json} the
 * model, input, output and seeds folders. Everything else keeps its bytes: the file is parsed as a
 * tree (member order and number text kept) and written in the format of the run's writers (pretty
 * printed, special floating point values allowed, a final newline).
 */
final class JsonPaths {
  private static final Gson GSON =
      new GsonBuilder().setPrettyPrinting().serializeSpecialFloatingPointValues().create();

  private JsonPaths() {}

  /** A record: {@code input.image|seeds|model.path} through {@code remote}. */
  static void record(Path file, UnaryOperator<String> remote) throws IOException {
    JsonObject o = read(file);
    JsonObject in = o.getAsJsonObject("input");
    if (in != null) {
      for (String key : new String[] {"image", "seeds", "model"}) {
        JsonElement e = in.get(key);
        if (e != null && e.isJsonObject() && e.getAsJsonObject().has("path")) {
          JsonObject entry = e.getAsJsonObject();
          entry.addProperty("path", remote.apply(entry.get("path").getAsString()));
        }
      }
    }
    write(file, o);
  }

  /** {@code run.started.json}: the model. */
  static void started(Path file, String model) throws IOException {
    JsonObject o = read(file);
    o.addProperty("model", model);
    write(file, o);
  }

  /** {@code run.json}: the model and the folders ({@code seeds} null if none). */
  static void run(Path file, String model, String in, String out, String seeds) throws IOException {
    JsonObject o = read(file);
    JsonObject m = o.getAsJsonObject("model");
    if (m != null) {
      m.addProperty("path", model);
    }
    JsonObject s = o.getAsJsonObject("settings");
    if (s != null) {
      s.addProperty("in", in);
      s.addProperty("out", out);
      if (seeds != null) {
        s.addProperty("seeds", seeds);
      }
    }
    write(file, o);
  }

  private static JsonObject read(Path file) throws IOException {
    return JsonParser.parseString(Files.readString(file, StandardCharsets.UTF_8)).getAsJsonObject();
  }

  private static void write(Path file, JsonObject o) throws IOException {
    Files.write(file, (GSON.toJson(o) + "\n").getBytes(StandardCharsets.UTF_8));
  }
}
