/**
 * The background gases around an absorber ({@link org.linewright.broadening.background.BackgroundGas}) and
 * their mole fractions ({@link org.linewright.broadening.background.Composition}, parsed from {@code GAS=X,...}).
 */
package org.linewright.broadening.background;
