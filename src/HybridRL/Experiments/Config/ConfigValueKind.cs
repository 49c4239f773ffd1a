namespace HybridRL.Experiments.Config;

/// <summary>Type of a configuration value. Internal representation: Integer → long, Number → double,
/// Boolean → bool, Text/Choice → string, IntegerList → EquatableList&lt;long&gt;, ChoiceList → EquatableList&lt;string&gt;.</summary>
public enum ConfigValueKind
{
    Integer,
    Number,
    Boolean,
    Text,
    Choice,
    IntegerList,
    ChoiceList,
}
