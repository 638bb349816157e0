#!/usr/bin/env python3
"""Writes src/Model/Seawater/Teos10Kernels.g.cs: straight-line Horner kernels for the TEOS-10
75-term specific-volume polynomial (Roquet et al. 2015, Ocean Modelling 90, 29) and its
derivatives, from the monomials present in src/Model/Data/Seawater/teos10_specvol75.csv.

Run from the repository root after changing the coefficient table's monomials:
    python3 tools/generate-teos10-kernels.py
    python3 tools/generate-teos10-kernels.py --check   # exit 1 if the committed file differs

Only the exponents are read; the coefficient values stay in the CSV and are loaded at run time.
Each kernel nests Horner schemes in a chosen variable order and skips the absent monomials. A
derivative with respect to one variable is taken by putting that variable outermost and running
the simultaneous Horner scheme (value and derivative) over its coefficient polynomials, so a
derivative costs about one extra fused multiply-add per power of that variable instead of a second
pass over the table.
"""
import csv
import itertools
import os
import sys

DEGREE = 6
NAMES = ("xs", "ys", "z")  # exponent i -> xs, j -> ys, k -> z
ROOT = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
CSV = os.path.join(ROOT, "src/Model/Data/Seawater/teos10_specvol75.csv")
OUT = os.path.join(ROOT, "src/Model/Seawater/Teos10Kernels.g.cs")


def dense_index(i, j, k):
    """Same layout as Teos10Polynomial.Index: k outermost, then j, then i."""
    n = 0
    for kk in range(k):
        m = DEGREE - kk + 1
        n += m * (m + 1) // 2
    for jj in range(j):
        n += DEGREE - k - jj + 1
    return n + i


def read_terms():
    with open(CSV, newline="") as f:
        rows = list(csv.reader(f))
    return sorted({(int(r[0]), int(r[1]), int(r[2])) for r in rows[1:] if r})


class Counter:
    def __init__(self):
        self.fma = 0
        self.mul = 0


def expr(terms, order, count):
    """Nested Horner expression for Σ c[n] Π var^e over terms (tuples of exponents), order outermost first."""
    if not order:
        assert len(terms) == 1
        return f"c[{dense_index(*terms[0])}]"
    u = order[0]
    groups = {}
    for t in terms:
        groups.setdefault(t[u], []).append(t)
    m = max(groups)
    acc = expr(groups[m], order[1:], count)
    for p in range(m - 1, -1, -1):
        if p in groups:
            acc = f"Fma({acc}, {NAMES[u]}, {expr(groups[p], order[1:], count)})"
            count.fma += 1
        else:
            acc = f"({acc}) * {NAMES[u]}"
            count.mul += 1
    return acc


def middle_statements(terms, order, target, count):
    """Statements that leave in `target` the polynomial over order[1:] (middle Horner as statements, innermost inline)."""
    mid = order[0]
    groups = {}
    for t in terms:
        groups.setdefault(t[mid], []).append(t)
    m = max(groups)
    lines = [f"{target} = {expr(groups[m], order[1:], count)};"]
    for q in range(m - 1, -1, -1):
        if q in groups:
            lines.append(f"{target} = Fma({target}, {NAMES[mid]}, {expr(groups[q], order[1:], count)});")
            count.fma += 1
        else:
            lines.append(f"{target} *= {NAMES[mid]};")
            count.mul += 1
    return lines


def kernel_body(terms, order, derivative, count):
    """Statements of a kernel: each coefficient polynomial of the outer variable formed in `w` just before
    it is needed (few values alive at once), then one Horner step over the outer variable, with its
    derivative by the simultaneous scheme when asked."""
    u = order[0]
    groups = {}
    for t in terms:
        groups.setdefault(t[u], []).append(t)
    m = max(groups)
    lines = [f"// Coefficient of {NAMES[u]}^{m}."]
    lines += [s.replace("w = ", "T v = ", 1) if i == 0 else s.replace("w", "v")
              for i, s in enumerate(middle_statements(groups[m], order[1:], "w", count))]
    declared_w = False
    first = True
    for p in range(m - 1, -1, -1):
        if derivative:
            if first:
                lines.append("T d = v;")
            else:
                lines.append(f"d = Fma(d, {NAMES[u]}, v);")
                count.fma += 1
        first = False
        if p in groups:
            lines.append(f"// Coefficient of {NAMES[u]}^{p}.")
            body = middle_statements(groups[p], order[1:], "w", count)
            if not declared_w:
                body[0] = "T " + body[0]
                declared_w = True
            lines += body
            lines.append(f"v = Fma(v, {NAMES[u]}, w);")
            count.fma += 1
        else:
            lines.append(f"v *= {NAMES[u]};")
            count.mul += 1
    return lines


def best_order(terms, outer=None):
    """The variable order with the fewest operations (outermost first), optionally with a fixed outer variable."""
    best = None
    for order in itertools.permutations(range(3)):
        if outer is not None and order[0] != outer:
            continue
        c = Counter()
        kernel_body(terms, order, outer is not None, c)
        key = (c.fma + c.mul, order)
        if best is None or key < best[0]:
            best = (key, order, c)
    return best[1], best[2]


def method(name, summary, out_doc, terms, outer):
    order, c = best_order(terms, outer)
    body = kernel_body(terms, order, outer is not None, Counter())
    sig_out = f", out T {out_doc[0]}" if outer is not None else ""
    order_text = ", ".join(NAMES[o] for o in order)
    lines = [
        f"    /// <summary>{summary}</summary>",
        f"    /// <remarks>Horner order {order_text} (outermost first): {c.fma} fused multiply-adds, {c.mul} multiplications.</remarks>",
        f"    internal static T {name}<T>(T xs, T ys, T z{sig_out}) where T : struct, IFloatingPointIeee754<T>",
        "    {",
        "        ReadOnlySpan<T> c = Teos10Coefficients<T>.Values;",
        f"        _ = c[DenseTermCount - 1];",
    ]
    lines += ["        " + s for s in body]
    if outer is not None:
        lines.append(f"        {out_doc[0]} = d;")
    lines.append("        return v;")
    lines.append("    }")
    return lines, (order_text, c.fma, c.mul)


def main():
    terms = read_terms()
    if len(terms) != 75 or any(sum(t) > DEGREE for t in terms):
        sys.exit(f"{CSV}: expected 75 distinct monomials of total degree <= {DEGREE}, found {len(terms)}")
    parts = []
    report = []
    for name, summary, out, outer in (
        ("SpecificVolume", "Specific volume v(xs, ys, z), m³/kg.", None, None),
        ("SpecificVolumeAndYDerivative", "Specific volume v and ∂v/∂ys (m³/kg per unit ys = Θ/40 °C).", ("dvdys",), 1),
        ("SpecificVolumeAndXDerivative", "Specific volume v and ∂v/∂xs (m³/kg per unit xs).", ("dvdxs",), 0),
    ):
        lines, info = method(name, summary, out, terms, outer)
        parts.append("\n".join(lines))
        report.append((name,) + info)
    size = (DEGREE + 1) * (DEGREE + 2) * (DEGREE + 3) // 6
    mask = [0] * size
    for t in terms:
        mask[dense_index(*t)] = 1
    rows = ",\n".join("        " + ", ".join(str(x) for x in mask[n:n + 28]) for n in range(0, size, 28))
    text = "\n".join([
        "// <auto-generated>",
        "// Written by tools/generate-teos10-kernels.py from the monomials of",
        "// src/Model/Data/Seawater/teos10_specvol75.csv. Do not edit; run the script again.",
        "// </auto-generated>",
        "using System.Numerics;",
        "",
        "namespace Thermostrat.Model.Seawater;",
        "",
        "internal static partial class Teos10Polynomial",
        "{",
        "    /// <summary>Whether the kernels evaluate xs^i ys^j z^k; the loader rejects a table with any other monomial.</summary>",
        "    internal static bool IsKernelTerm(int i, int j, int k) => KernelTermMask[Index(i, j, k)] != 0;",
        "",
        "    /// <summary>1 where the dense layout of <see cref=\"Index\"/> holds a monomial of the polynomial, 0 where it is absent.</summary>",
        f"    private static ReadOnlySpan<byte> KernelTermMask =>\n    [\n{rows},\n    ];",
        "",
        "\n\n".join(parts),
        "}",
        "",
    ])
    if "--check" in sys.argv[1:]:
        with open(OUT, newline="") as f:
            if f.read() != text:
                sys.exit(f"{OUT} is not what the generator writes from {CSV}; run tools/generate-teos10-kernels.py")
        print("up to date")
        return
    with open(OUT, "w", newline="\n") as f:
        f.write(text)
    for r in report:
        print(f"{r[0]}: order {r[1]}, {r[2]} FMA + {r[3]} MUL")


if __name__ == "__main__":
    main()
