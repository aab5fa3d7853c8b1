/**
 * Line widths and shifts at a state (p, T): the Doppler half width
 * ({@link org.linewright.broadening.width.DopplerWidth}) and the Lorentz half width and pressure shift of a gas
 * mixture ({@link org.linewright.broadening.width.PressureBroadening}). Pressures in atm.
 */
package org.linewright.broadening.width;
