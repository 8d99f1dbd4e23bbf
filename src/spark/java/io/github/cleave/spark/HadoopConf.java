package io.github.cleave.spark;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.Serializable;
import java.io.UncheckedIOException;
import org.apache.hadoop.conf.Configuration;

/**
 * A Hadoop {@link Configuration} as a serialisable value: the driver's (with the job's {@code
 * spark.hadoop.*} settings), so that executors reach the file systems with the same settings.
 * Immutable; {@link #get} gives each caller its own copy.
 */
final class HadoopConf implements Serializable {
  private static final long serialVersionUID = 1L;

  private final byte[] bytes;

  HadoopConf(Configuration conf) {
    ByteArrayOutputStream b = new ByteArrayOutputStream();
    try (DataOutputStream out = new DataOutputStream(b)) {
      conf.write(out);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot copy the Hadoop configuration: " + e, e);
    }
    this.bytes = b.toByteArray();
  }

  /** A fresh configuration with the driver's entries (no defaults loaded on top). */
  Configuration get() {
    Configuration conf = new Configuration(false);
    try (DataInputStream in = new DataInputStream(new ByteArrayInputStream(bytes))) {
      conf.readFields(in);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read the Hadoop configuration: " + e, e);
    }
    return conf;
  }
}
