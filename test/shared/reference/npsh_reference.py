"""Reference values for the NPSH tests, from python3-fluids and python3-iapws.

Reads one JSON request on stdin, {"elevations": [m, ...], "temperatures": [t_C, ...]}, and prints:
  {"fluidsVersion": ..., "iapwsVersion": ..., "atmosphere": [Pa, ...],
   "water": [{"vapourPressure": Pa, "density": kg/m3}, ...]}
the pressure of the 1976 US Standard Atmosphere (fluids.atmosphere.ATMOSPHERE_1976), the
saturation pressure of IAPWS-IF97 saturated liquid and the IF97 density at 101.325 kPa.
"""
import json
import sys

import fluids
import iapws
from fluids.atmosphere import ATMOSPHERE_1976
from iapws import IAPWS97


def water(t):
    return {
        "vapourPressure": IAPWS97(T=t + 273.15, x=0).P * 1e6,
        "density": IAPWS97(T=t + 273.15, P=0.101325).rho,
    }


request = json.load(sys.stdin)
json.dump(
    {
        "fluidsVersion": fluids.__version__,
        "iapwsVersion": iapws.__version__,
        "atmosphere": [ATMOSPHERE_1976(z).P for z in request["elevations"]],
        "water": [water(t) for t in request["temperatures"]],
    },
    sys.stdout,
)
