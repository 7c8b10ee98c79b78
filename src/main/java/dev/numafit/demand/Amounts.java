package dev.numafit.demand;

import java.math.BigDecimal;
import java.math.RoundingMode;

/**
 * Prints exact resource amounts in Kubernetes' own notation for messages: CPU in cores or
 * millicores ({@code 2}, {@code 1500m}), byte resources with the largest binary suffix that is
 * exact ({@code 80Mi}), everything else as a plain number.
 */
public final class Amounts {
  private static final String[] BINARY = {"Ki", "Mi", "Gi", "Ti", "Pi", "Ei"};

  private Amounts() {}

  /**
   * One amount of a resource, in base units (cores for {@code cpu}, bytes for memory, storage and
   * hugepages).
   */
  public static String format(String resource, BigDecimal amount) {
    BigDecimal a = amount.stripTrailingZeros();
    if (resource.equals("cpu")) {
      if (a.scale() <= 0) {
        return a.toBigInteger().toString();
      }
      return a.movePointRight(3).stripTrailingZeros().toPlainString() + "m";
    }
    boolean bytes =
        resource.equals("memory")
            || resource.equals("ephemeral-storage")
            || resource.startsWith("hugepages-");
    if (!bytes || a.scale() > 0 || a.signum() == 0) {
      return a.toPlainString();
    }
    BigDecimal k = BigDecimal.valueOf(1024);
    String suffix = "";
    for (String s : BINARY) {
      BigDecimal[] qr = a.divideAndRemainder(k);
      if (qr[1].signum() != 0) {
        break;
      }
      a = qr[0];
      suffix = s;
    }
    return a.setScale(0, RoundingMode.UNNECESSARY).toPlainString() + suffix;
  }
}
