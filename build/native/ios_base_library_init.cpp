// Defines std::ios_base_library_init(), the iostream initialiser that GCC 13's libstdc++ exports
// as GLIBCXX_3.4.32 and that TorchSharp's native wrapper references. Older libstdc++ (GCC 12 and
// earlier) lacks it; HybridRL loads this object globally before TorchSharp so the reference resolves.
#include <ios>

namespace std {
void ios_base_library_init() { static ios_base::Init init; }
}
