/**
 * Table plans: the TOML file that says which lines, grid, pressures, temperatures, background gases, line shape,
 * engine and output a cross-section table has ({@link org.linewright.grid.plan.PlanReader},
 * {@link org.linewright.grid.plan.TablePlan}), and the cache of line stores ingested from a plan's raw line lists
 * ({@link org.linewright.grid.plan.LineCache}). Documented in {@code docs/table-format.md}.
 */
package org.linewright.grid.plan;
