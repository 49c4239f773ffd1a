namespace HybridRL.Experiments.Config;

/// <summary>
/// Implemented by HybridRL's configuration providers: lists the flattened keys a layer defines and
/// where each value came from (file and line, or the override that set it).
/// </summary>
public interface IConfigOriginSource
{
    /// <summary>Flattened keys ("a:b:c") this layer defines, including keys whose value is null.</summary>
    IEnumerable<string> DefinedKeys { get; }

    /// <summary>Origin of a flattened key or of a section/list prefix this layer defines.</summary>
    bool TryGetOrigin(string key, out ConfigOrigin origin);
}
