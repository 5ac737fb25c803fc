using DistTree.Conductors;

namespace DistTree.ProjectFiles.Writing;

/// <summary>A run as a written file gives it: <c>{ length: L, size: S, sets: N, ocpd: A }</c>, sets written above 1 and the device when known.</summary>
/// <param name="Length">The one-way length, in the unit of the file's bare lengths.</param>
/// <param name="Size">The conductor size.</param>
/// <param name="Sets">Parallel sets, 1 or more.</param>
/// <param name="OcpdA">The overcurrent device's rating in amperes, or null to write none.</param>
internal readonly record struct WrittenRun(double Length, ConductorSize Size, int Sets, double? OcpdA);
