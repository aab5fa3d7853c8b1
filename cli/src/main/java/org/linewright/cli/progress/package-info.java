/** Progress bars on stderr that stay silent off a terminal or with --quiet. */
package org.linewright.cli.progress;
