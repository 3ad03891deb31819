package dev.plumb.units;

/**
 * A built-in physical constant with its published source.
 *
 * <p>{@code value} is in {@code unit}, which for every built-in constant is coherent SI
 * (factor 1), so {@code value} is also the SI value.
 */
public record Constant(String name, double value, Unit unit, String description, String source) {}
