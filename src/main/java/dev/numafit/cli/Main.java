package dev.numafit.cli;

/** Entry point placeholder. */
public final class Main {
  private Main() {}

  public static void main(String... args) {
    System.out.println("numafit");
  }
}
