package io.github.cleave.io;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import io.github.cleave.image.BadInputException;

/**
 * Reads required fields of a JSON object with messages that name the field and the file, so that a
 * damaged or foreign file is reported as what it is instead of failing deep inside.
 */
final class JsonFields {
  private final JsonObject object;
  private final String where; // e.g. "model file x.json, field settings"

  JsonFields(JsonObject object, String where) {
    this.object = object;
    this.where = where;
  }

  JsonFields object(String name) {
    JsonElement e = require(name);
    if (!e.isJsonObject()) {
      throw wrong(name, "an object");
    }
    return new JsonFields(e.getAsJsonObject(), where + ", field " + name);
  }

  JsonObject raw() {
    return object;
  }

  boolean has(String name) {
    return object.has(name) && !object.get(name).isJsonNull();
  }

  String string(String name) {
    JsonElement e = require(name);
    if (!e.isJsonPrimitive() || !e.getAsJsonPrimitive().isString()) {
      throw wrong(name, "a string");
    }
    return e.getAsString();
  }

  double number(String name) {
    JsonElement e = require(name);
    if (!e.isJsonPrimitive() || !e.getAsJsonPrimitive().isNumber()) {
      throw wrong(name, "a number");
    }
    return e.getAsDouble();
  }

  /** A number, or {@code absent} when the field is missing or null. */
  double numberOr(String name, double absent) {
    return has(name) ? number(name) : absent;
  }

  int integer(String name) {
    double v = number(name);
    if (v != Math.rint(v) || Math.abs(v) > Integer.MAX_VALUE) {
      throw wrong(name, "a whole number");
    }
    return (int) v;
  }

  boolean bool(String name) {
    JsonElement e = require(name);
    if (!e.isJsonPrimitive() || !e.getAsJsonPrimitive().isBoolean()) {
      throw wrong(name, "true or false");
    }
    return e.getAsBoolean();
  }

  /** An array of whole numbers, or null when the field is missing or null. */
  int[] integersOrNull(String name) {
    if (!has(name)) {
      return null;
    }
    JsonElement e = object.get(name);
    if (!e.isJsonArray()) {
      throw wrong(name, "an array of whole numbers");
    }
    JsonArray a = e.getAsJsonArray();
    int[] out = new int[a.size()];
    for (int i = 0; i < out.length; i++) {
      JsonElement v = a.get(i);
      if (!v.isJsonPrimitive()
          || !v.getAsJsonPrimitive().isNumber()
          || v.getAsDouble() != Math.rint(v.getAsDouble())
          || Math.abs(v.getAsDouble()) > Integer.MAX_VALUE) {
        throw wrong(name, "an array of whole numbers");
      }
      out[i] = v.getAsInt();
    }
    return out;
  }

  BadInputException wrong(String name, String expected) {
    return new BadInputException(
        where
            + ": field '"
            + name
            + "' must be "
            + expected
            + "; the file is damaged or was not"
            + " written by Cleave");
  }

  private JsonElement require(String name) {
    if (!object.has(name) || object.get(name).isJsonNull()) {
      throw new BadInputException(
          where
              + ": field '"
              + name
              + "' is missing; the file is damaged or was not written by"
              + " Cleave");
    }
    return object.get(name);
  }
}
