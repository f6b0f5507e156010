#!/usr/bin/env python3
"""Convert the CIE's published dataset files into Lumen's data-cie/ format.

Lumen's format: one CSV per table, UTF-8 without BOM, LF line endings, a header row
naming every column (wavelength column `wavelength_nm`), then the CIE's numbers copied as
text, digit for digit. A cell the CIE publishes as NaN ("no value in the source
publication"; the CIE metadata says to extrapolate with zero) is written empty.

Usage: python3 tools/convert_cie.py [data-cie/originals] [data-cie]
Re-running it rewrites data-cie/*.csv and data-cie/README.md.
"""
import hashlib
import json
import os
import re
import sys

# (CIE file stem, Lumen table name, column names after the wavelength column or None to
#  take the CIE column titles)
TABLES = [
    ("CIE_xyz_1931_2deg", "cmf_1931_2deg", ["x_bar", "y_bar", "z_bar"]),
    ("CIE_xyz_1964_10deg", "cmf_1964_10deg", ["x_bar_10", "y_bar_10", "z_bar_10"]),
    ("CIE_std_illum_A_1nm", "illuminant_A", ["A"]),
    ("CIE_std_illum_D65", "illuminant_D65", ["D65"]),
    ("CIE_std_illum_D50", "illuminant_D50", ["D50"]),
    ("CIE_illum_Dxx_comp", "daylight_components", ["S0", "S1", "S2"]),
    ("CIE_srf_cri", "cri_test_samples", [f"TCS{k:02d}" for k in range(1, 15)]),
    ("CIE_srf_cfi_1nm", "cfi_colour_evaluation_samples_1nm", [f"CES{k:02d}" for k in range(1, 100)]),
    ("CIE_srf_cfi", "cfi_colour_evaluation_samples_5nm", [f"CES{k:02d}" for k in range(1, 100)]),
    ("CIE_sle_photopic", "luminous_efficiency_photopic", ["V"]),
    ("CIE_sle_scotopic", "luminous_efficiency_scotopic", ["V_prime"]),
    ("CIE_a-opic_action_spectra", "alpha_opic_action_spectra",
     ["s_cone_opic", "m_cone_opic", "l_cone_opic", "rhodopic", "melanopic"]),
    ("CIE_illum_FLs", "illuminants_FL_5nm", None),
    ("CIE_illum_FLs_1nm", "illuminants_FL_1nm", None),
    ("CIE_illum_HPs", "illuminants_HP_5nm", None),
    ("CIE_illum_LEDs", "illuminants_LED_5nm", None),
    ("CIE_illum_LEDs_1nm", "illuminants_LED_1nm", None),
    ("CIE_illum_C", "illuminant_C", ["C"]),
    ("CIE_illum_D55", "illuminant_D55", ["D55"]),
    ("CIE_illum_D75", "illuminant_D75", ["D75"]),
]


def clean_title(t: str) -> str:
    return re.sub(r"[^A-Za-z0-9_\-]", "_", t.strip())


def main() -> None:
    src = sys.argv[1] if len(sys.argv) > 1 else os.path.join("data-cie", "originals")
    dst = sys.argv[2] if len(sys.argv) > 2 else "data-cie"
    os.makedirs(dst, exist_ok=True)
    rows_md = []
    for stem, name, cols in TABLES:
        raw = open(os.path.join(src, stem + ".csv"), "rb").read()
        meta = json.load(open(os.path.join(src, stem + ".csv_metadata.json"), encoding="utf-8"))
        sha = hashlib.sha256(raw).hexdigest()
        text = raw.decode("utf-8-sig")
        lines = [ln for ln in text.replace("\r\n", "\n").split("\n") if ln.strip()]
        headers = meta["datatableInfo"]["columnHeaders"]
        if cols is None:
            cols = [clean_title(h["title"]) for h in headers[1:]]
        out = ["wavelength_nm," + ",".join(cols)]
        for ln in lines:
            cells = ln.split(",")
            if len(cells) != len(cols) + 1:
                raise SystemExit(f"{stem}: expected {len(cols) + 1} cells, got {len(cells)}: {ln}")
            out.append(",".join("" if c.strip().lower() == "nan" else c.strip() for c in cells))
        with open(os.path.join(dst, name + ".csv"), "w", encoding="utf-8", newline="\n") as f:
            f.write("\n".join(out) + "\n")
        title = meta["titles"][0]["title"].strip()
        doi = meta["identifier"]["identifier"]
        year = meta["publicationYear"]
        related = "; ".join(t for r in meta.get("relatedItems", []) if r.get("relationType") == "IsPartOf"
                            for t in r.get("titles", []))
        m = re.search(r"original source: ([^\n]*?)\.?$", meta["descriptions"][0]["description"])
        if m:
            related = m.group(1) + (" (in: " + related + ")" if related else "")
        rows_md.append(f"| `{name}.csv` | `{stem}.csv` | {title} | [{doi}](https://doi.org/{doi}) | {year} | {related} | `{sha}` |")
    readme = README_HEAD + "\n".join(rows_md) + "\n" + README_TAIL
    with open(os.path.join(dst, "README.md"), "w", encoding="utf-8", newline="\n") as f:
        f.write(readme)


README_HEAD = """# data-cie: the CIE tables Lumen uses

Every table here is converted from a dataset that the International Commission on
Illumination (CIE) publishes (https://cie.co.at/data-tables) by `tools/convert_cie.py`,
from the CIE's published originals kept unchanged in `originals/` (with their metadata and published SHA-256). The build embeds these files into
`Lumen.Core`, so the `lumen` command works from any folder.

## Licence and attribution
All tables: © International Commission on Illumination (CIE), licensed under Creative
Commons Attribution-ShareAlike 4.0 International (CC BY-SA 4.0),
https://creativecommons.org/licenses/by-sa/4.0/. These converted copies are shared under the
same licence. Attribution form: International Commission on Illumination (CIE) (*year*).
*Title*. CIE, Vienna, AT. https://doi.org/*DOI*. Licensed under CC BY-SA 4.0.

## Format (Lumen's own)
- UTF-8 without byte-order mark, LF line endings, comma-separated.
- First row: column names. First column `wavelength_nm` (nm, in air as the CIE tabulates).
- Every number is the CIE's published text, digit for digit (nothing is rounded or re-scaled).
- An empty cell is a value the CIE publishes as `NaN` ("no value in the source publication");
  the CIE metadata gives `extrapolationMethod: zero`, so Lumen reads an empty cell as 0.
- A test (`tests/Lumen.Core.Tests/CieDataTests.cs`) checks the SHA-256 of every original in `originals/`
  against `originals/SHA256SUMS` and compares every embedded value with it, in every clone.

## Tables
| Lumen file | CIE file | Title | DOI | Year | Source publication | SHA-256 of the CIE original |
|---|---|---|---|---|---|---|
"""

README_TAIL = """
Each SHA-256 is that of the CIE's published file (it equals the checksum in the CIE metadata
record); `sha256sum --check originals/SHA256SUMS` (run in data-cie/) checks the originals.
"""

if __name__ == "__main__":
    main()
