namespace HybridRL.Checkpoints;

/// <summary>Content of the <c>best</c> pointer file: the best-scoring checkpoint's file name and its score.</summary>
public readonly record struct BestCheckpointPointer(string FileName, double Score);
