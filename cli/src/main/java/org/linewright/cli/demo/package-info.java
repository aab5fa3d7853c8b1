/**
 * The demo: the synthetic line-list generator (invented data for a fictional planet), the demo steps and
 * the demo report.
 */
package org.linewright.cli.demo;
