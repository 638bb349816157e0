using System.Runtime.CompilerServices;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>Stack scratch space for one right-hand-side evaluation (any number type, no heap).</summary>
[InlineArray(Capacity)]
internal struct Scratch256<T>
{
    public const int Capacity = 256;
    private T _element0;
}

/// <summary>Stack space for the parameters converted to a number type other than double.</summary>
[InlineArray(Capacity)]
internal struct Scratch128<T>
{
    public const int Capacity = 128;
    private T _element0;
}
