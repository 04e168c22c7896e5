"""Excess-air sweep of an invented gas-fired boiler into a pandas DataFrame and a PNG plot.

INVENTED DEMO PLANT - not a real facility; the figures are illustrative only.
Run from the repository after scripts/build:

    PYTHONPATH=build/python /usr/bin/python3 python/examples/excess_air_sweep.py excess_air_sweep.png
"""
import sys

import matplotlib

matplotlib.use("Agg")  # write files only, no window
import matplotlib.pyplot as plt
import pandas

import stackbound

# Hot-water boiler HW-1 of the invented Juniper Flats Greenhouses, on pipeline natural gas.
CASE = {
    "case": {
        "title": "Juniper Flats Greenhouses, boiler HW-1 (invented demo plant)",
        "plant_type": "ied-liquid-gaseous",
    },
    "fuel": {"preset": "natural_gas", "feed_rate": "3.2 MW"},
    "air": {"temperature": "20 degC", "relative_humidity": "70 %", "ambient_temperature": "12 degC"},
    "operating_point": {"excess_air": "15 %"},
    "firing": {"adiabatic": True, "heat_loss": "18 %"},
    "stack": {"temperature": "140 degC"},
    "report": {"reference_o2": "3 %", "pollutants": ["CO", "NO", "NOx"]},
}


def main(png_path):
    columns = stackbound.sweep(CASE, ["excess_air=5%:60%:23"])
    frame = pandas.DataFrame(columns)
    failed = frame[frame["status"] != "ok"]
    if not failed.empty:
        raise SystemExit(f"{len(failed)} sweep points failed: {failed['error'].iloc[0]}")

    print(frame[["vary_excess_air_percent", "firing_temperature_K", "flue_o2_dry_percent",
                 "NOx_mg_per_Nm3_at_ref_o2", "CO_mg_per_Nm3_at_ref_o2"]].to_string(index=False))

    figure, axes = plt.subplots(figsize=(7, 4.5))
    axes.semilogy(frame["vary_excess_air_percent"], frame["NOx_mg_per_Nm3_at_ref_o2"], "o-", label="NOx bound (as NO2)")
    axes.semilogy(frame["vary_excess_air_percent"], frame["CO_mg_per_Nm3_at_ref_o2"], "s-", label="CO bound")
    axes.set_xlabel("excess air [%]")
    axes.set_ylabel("mg/Nm3, dry, at 3 % O2 (0 degC, 101.325 kPa)")
    axes.set_title("Boiler HW-1 (invented): equilibrium bounds, adiabatic firing")
    axes.grid(True, which="both", alpha=0.3)
    axes.legend()
    figure.text(0.01, 0.01, "Equilibrium bounds, not measurements; permits, regulators and licensed practice govern.",
                fontsize=7)
    figure.tight_layout(rect=(0, 0.03, 1, 1))
    figure.savefig(png_path, dpi=120)
    print(f"wrote {png_path}")


if __name__ == "__main__":
    main(sys.argv[1] if len(sys.argv) > 1 else "excess_air_sweep.png")
