namespace HybridRL.Experiments.Config;

/// <summary>A problem with one environment parameter.</summary>
/// <param name="Parameter">Key relative to the environment section (e.g. <c>slip_probability</c>, <c>map:2</c>); empty = the section as a whole.</param>
/// <param name="Message">What is wrong (e.g. "unknown parameter; did you mean 'slip_probability'?").</param>
public sealed record EnvironmentParameterProblem(string Parameter, string Message);
