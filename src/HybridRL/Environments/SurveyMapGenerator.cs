using HybridRL.Quantum.Randomness;

namespace HybridRL.Environments;

/// <summary>
/// Procedural survey maps (our own scheme): each cell of a size × size square is a wall with probability
/// <c>wall_density</c>; the start is a random free cell; cells not reachable from the start become walls; the target
/// is a random reachable cell at least half the largest reachable path distance away. Same seed, same map.
/// </summary>
public static class SurveyMapGenerator
{
    public static GridMap Generate(int size, double wallDensity, ulong seed)
    {
        if (size < 2) throw new ArgumentOutOfRangeException(nameof(size), size, "map size must be at least 2");
        if (!(wallDensity >= 0 && wallDensity < 1)) throw new ArgumentOutOfRangeException(nameof(wallDensity), wallDensity, "wall density must be in [0, 1)");
        var rng = RandomStream.FromRoot(seed, "survey-map");
        var cells = new GridCell[size, size];
        var dist = new int[size * size];
        var queue = new int[size * size];
        for (int attempt = 0; attempt < 10_000; attempt++)
        {
            var free = new List<int>();
            for (int r = 0; r < size; r++)
                for (int c = 0; c < size; c++)
                {
                    bool wall = rng.NextDouble() < wallDensity;
                    cells[r, c] = wall ? GridCell.Blocked : GridCell.Floor;
                    if (!wall) free.Add(r * size + c);
                }
            if (free.Count < 2) continue;
            int start = free[rng.NextInt(free.Count)];
            // Breadth-first distances from the start.
            Array.Fill(dist, -1);
            int head = 0, tail = 0, maxDist = 0;
            dist[start] = 0;
            queue[tail++] = start;
            while (head < tail)
            {
                int k = queue[head++];
                int r = k / size, c = k % size;
                Span<int> nr = [r - 1, r, r + 1, r];
                Span<int> nc = [c, c + 1, c, c - 1];
                for (int d = 0; d < 4; d++)
                {
                    if (nr[d] < 0 || nr[d] >= size || nc[d] < 0 || nc[d] >= size) continue;
                    int n = nr[d] * size + nc[d];
                    if (cells[nr[d], nc[d]] == GridCell.Blocked || dist[n] >= 0) continue;
                    dist[n] = dist[k] + 1;
                    maxDist = Math.Max(maxDist, dist[n]);
                    queue[tail++] = n;
                }
            }
            if (tail < 2) continue;
            var far = new List<int>();
            for (int i = 0; i < tail; i++)
                if (dist[queue[i]] >= Math.Max(1, (maxDist + 1) / 2)) far.Add(queue[i]);
            int target = far[rng.NextInt(far.Count)];
            for (int k = 0; k < size * size; k++)
                if (dist[k] < 0) cells[k / size, k % size] = GridCell.Blocked;
            cells[start / size, start % size] = GridCell.Start;
            cells[target / size, target % size] = GridCell.Goal;
            return new GridMap(cells);
        }
        throw new InvalidOperationException($"could not generate a survey map of size {size} with wall density {wallDensity:R}: walls leave no open path");
    }
}
