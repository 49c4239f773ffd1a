using HybridRL.Experiments.Config;
using HybridRL.Logging;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// The <see cref="ITrainTask"/> of the application: loads the base experiment with the run's overrides through the config loader
/// (the same way <c>hybridrl train FILE --set k=v</c> does, including <c>HYBRIDRL_*</c> variables) and runs a
/// <see cref="TrainingSession"/> in <c>runsDir/runName/runId</c>. The session takes the run lock, resumes from the newest
/// valid checkpoint when the folder has one, and returns 0 done, 1 failure or 3 interrupted; a bad config throws
/// <see cref="ConfigException"/> before any file is written.
/// </summary>
public sealed class SessionTrainTask(Verbosity verbosity, TextWriter output, IDictionary<string, string> environmentVariables) : ITrainTask
{
    public int Run(string baseConfigPath, IReadOnlyList<string> overrides, string runsDir, string runName, string runId, CancellationToken ct)
    {
        var spec = ExperimentSpecLoader.Load([baseConfigPath], overrides, environmentVariables);
        var session = TrainingSession.Create(spec, runsDir, runName, runId, verbosity, output);
        return session.Run(ct);
    }
}
