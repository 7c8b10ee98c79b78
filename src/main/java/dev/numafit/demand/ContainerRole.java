package dev.numafit.demand;

/** The part a container plays in its pod's request arithmetic (FACTS A1). */
public enum ContainerRole {
  /** A regular container in {@code spec.containers}. */
  APP,
  /** An init container that runs to completion before the app containers start. */
  INIT,
  /** An init container with {@code restartPolicy: Always}: it keeps running beside the app. */
  SIDECAR
}
