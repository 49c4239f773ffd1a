using System.Text.Json;
using System.Text.Json.Nodes;

namespace HybridRL.Experiments.Inspection;

/// <summary>
/// The contents of a run folder's <c>resources.json</c>, written when the run starts: the sections of
/// <c>hybridrl inspect --json</c> that describe what the run's model needs, under the same keys —
/// <c>model</c>, <c>circuit</c> (qubits, gates, gates_by_kind, depth, two_qubit_gates, … without the drawing
/// and the OpenQASM text) and <c>executions</c>. A classical model has no circuit and no executions, and
/// like the inspection the file then leaves both out. Parameter counts stay in summary.json and metrics.csv;
/// the memory estimate depends on the machine and is not a property of the run.
/// </summary>
public static class RunResources
{
    private static readonly string[] Sections = [Key(nameof(ExperimentInspection.Model)), Key(nameof(ExperimentInspection.Circuit)), Key(nameof(ExperimentInspection.Executions))];
    private static readonly string[] TextOnly = [Key(nameof(CircuitInspection.Drawing)), Key(nameof(CircuitInspection.Qasm))];
    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };

    /// <summary>resources.json text for <paramref name="inspection"/>.</summary>
    public static string ToJson(ExperimentInspection inspection)
    {
        ArgumentNullException.ThrowIfNull(inspection);
        var all = JsonNode.Parse(inspection.ToJson())!.AsObject();
        var result = new JsonObject();
        foreach (string section in Sections)
            if (all[section] is { } value) result[section] = value.DeepClone();
        if (result[Key(nameof(ExperimentInspection.Circuit))] is JsonObject circuit)
            foreach (string key in TextOnly) circuit.Remove(key);
        return result.ToJsonString(Indented) + "\n";
    }

    private static string Key(string propertyName) => JsonNamingPolicy.SnakeCaseLower.ConvertName(propertyName);
}
