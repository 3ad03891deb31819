package dev.plumb.symbolic;

/**
 * One transformation in the derivation of a closed form.
 *
 * @param action what was done: "substitute", "integrate", "apply boundary surface", "simplify", ...
 * @param result the expression after it, in plumb syntax
 */
public record TrailStep(String action, String result) { }
