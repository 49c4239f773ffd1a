namespace HybridRL; internal static class AssemblyMarker {}
