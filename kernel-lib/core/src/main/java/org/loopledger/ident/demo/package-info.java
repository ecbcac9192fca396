/**
 * SYNTHETIC demo axes and their datasets, invented for demos and tests: the laser-marking gantry's X axis
 * ({@link org.loopledger.ident.demo.GantryAxis}, three {@link org.loopledger.ident.demo.GantryLoadCase}s, simulated in
 * closed loop by {@link org.loopledger.ident.demo.GantrySimulator}) and a linear pick-and-place Y axis
 * ({@link org.loopledger.ident.demo.LinearAxis}, exported as an oscilloscope file by
 * {@link org.loopledger.ident.demo.LinearAxisScope}). {@link org.loopledger.ident.demo.DemoDatasets} writes the
 * files in {@code datasets/} deterministically (fixed seeds). None of these numbers describe a real machine.
 */
package org.loopledger.ident.demo;
