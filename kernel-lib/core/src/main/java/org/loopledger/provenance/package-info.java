/**
 * Where results came from: {@link org.loopledger.provenance.Provenance} records every dataset file a loader opened,
 * with its SHA-256, so that a tuning record can state (and {@code verify} can check) exactly which data it was
 * computed from.
 */
package org.loopledger.provenance;
