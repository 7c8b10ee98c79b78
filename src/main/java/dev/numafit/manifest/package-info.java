/**
 * Reads Kubernetes manifests into the core {@link dev.numafit.demand.Demand}: the adapter where
 * fabric8 model types and Jackson trees live. Nothing from here leaks into the core packages; the
 * request arithmetic itself is in {@link dev.numafit.demand.PodArithmetic}.
 */
package dev.numafit.manifest;
