/**
 * From text to analysis: {@link dev.plumb.pipeline.Analyzer} runs every stage on one file (syntax,
 * model and units, closed forms and verdicts, cases and sweeps, scaling) and returns the
 * {@link dev.plumb.report.Analysis} that every output reads. The command line ({@code check},
 * {@code report}, {@code check --watch}) and the language server call it alike and differ only in how
 * they show the result.
 */
package dev.plumb.pipeline;
