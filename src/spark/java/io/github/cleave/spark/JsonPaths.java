package io.github.cleave.spark;

import com.google.gson.Gson;
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
 * model, input, output and seeds folders. Every other byte stays: the file is parsed only to find
 * the old values, and each {@code "KEY": "OLD"} member as the run's writers print it (pretty
 * printed, JSON string escapes) is replaced in the text by {@code "KEY": "NEW"}.
 */
final class JsonPaths {
  private static final Gson GSON = new Gson();

  private JsonPaths() {}

  /** A record: {@code input.image|seeds|model.path} through {@code remote}. */
  static void record(Path file, UnaryOperator<String> remote) throws IOException {
    String text = Files.readString(file, StandardCharsets.UTF_8);
    JsonObject in = JsonParser.parseString(text).getAsJsonObject().getAsJsonObject("input");
    if (in != null) {
      for (String key : new String[] {"image", "seeds", "model"}) {
        JsonElement e = in.get(key);
        if (e != null && e.isJsonObject() && e.getAsJsonObject().has("path")) {
          String old = e.getAsJsonObject().get("path").getAsString();
          text = member(text, "path", old, remote.apply(old));
        }
      }
    }
    Files.writeString(file, text, StandardCharsets.UTF_8);
  }

  /** {@code run.started.json}: the model. */
  static void started(Path file, String model) throws IOException {
    String text = Files.readString(file, StandardCharsets.UTF_8);
    JsonObject o = JsonParser.parseString(text).getAsJsonObject();
    text = member(text, "model", string(o, "model"), model);
    Files.writeString(file, text, StandardCharsets.UTF_8);
  }

  /** {@code run.json}: the model and the folders ({@code seeds} null if none). */
  static void run(Path file, String model, String in, String out, String seeds) throws IOException {
    String text = Files.readString(file, StandardCharsets.UTF_8);
    JsonObject o = JsonParser.parseString(text).getAsJsonObject();
    JsonObject m = o.getAsJsonObject("model");
    if (m != null) {
      text = member(text, "path", string(m, "path"), model);
    }
    JsonObject s = o.getAsJsonObject("settings");
    if (s != null) {
      text = member(text, "in", string(s, "in"), in);
      text = member(text, "out", string(s, "out"), out);
      if (seeds != null) {
        text = member(text, "seeds", string(s, "seeds"), seeds);
      }
    }
    Files.writeString(file, text, StandardCharsets.UTF_8);
  }

  private static String string(JsonObject o, String key) {
    JsonElement e = o.get(key);
    return e == null || !e.isJsonPrimitive() ? null : e.getAsString();
  }

  /** The text with the member {@code "key": old} (as printed) set to {@code now}. */
  private static String member(String text, String key, String old, String now) {
    if (old == null || old.equals(now)) {
      return text;
    }
    return text.replace(
        GSON.toJson(key) + ": " + GSON.toJson(old), GSON.toJson(key) + ": " + GSON.toJson(now));
  }
}
