/**
 * The Jupyter wire protocol (messaging specification 5.3), independent of sockets:
 * {@link org.loopledger.kernel.protocol.ConnectionInfo} (the connection file),
 * {@link org.loopledger.kernel.protocol.Message} and {@link org.loopledger.kernel.protocol.Headers},
 * {@link org.loopledger.kernel.protocol.WireCodec} (multipart frames; decoding never throws) and
 * {@link org.loopledger.kernel.protocol.MessageSigner} (HMAC-SHA256, constant-time verification).
 */
package org.loopledger.kernel.protocol;
