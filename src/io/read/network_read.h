/* network_read.h - reading a network back from its XML (doc/results.md).
 *
 * The file is a results document (root <results>) holding one <network>
 * (or a <retrofit>, whose first proposal's network is read), or a bare
 * <network>. Every attribute is checked for its type (xml_attr.h)
 * and every exchanger's hot and cold name must be a stream or utility of
 * the network; whether the numbers agree is the check's business
 * (netcheck.h), not the reader's. A DOCTYPE is refused (entities could
 * expand without bound or read other files); the network is never used.
 *
 * Errors: HL_EINPUT naming file and line (not XML, no network, a missing,
 * unknown or malformed attribute, an unknown name), HL_EIO (cannot read,
 * out of memory).
 */
#ifndef HL_NETWORK_READ_H
#define HL_NETWORK_READ_H

#include <stddef.h>

#include "network.h"
#include "status.h"

hl_status hl_network_xml_read(const char *path, hl_network **out,
			      hl_error *err);

/* Same from memory; name is used in messages and as the source. */
hl_status hl_network_xml_read_mem(const char *name, const char *data,
				  size_t len, hl_network **out,
				  hl_error *err);

#endif
