package dev.numafit.cli;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;
import picocli.CommandLine.IVersionProvider;

/**
 * The version from the pom.properties Maven puts in the jar; {@code development build} when run
 * from compiled classes.
 */
final class VersionProvider implements IVersionProvider {
  static String version() {
    try (InputStream in =
        VersionProvider.class.getResourceAsStream(
            "/META-INF/maven/dev.numafit/numafit/pom.properties")) {
      if (in != null) {
        Properties p = new Properties();
        p.load(in);
        return p.getProperty("version", "development build");
      }
    } catch (IOException ex) {
      // fall through: a missing version is not worth failing for
    }
    return "development build";
  }

  @Override
  public String[] getVersion() {
    return new String[] {"numafit " + version()};
  }
}
