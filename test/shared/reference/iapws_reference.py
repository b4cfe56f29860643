"""Reference values from python3-iapws for the water-property tests.

Reads one JSON request on stdin, {"temperatures": [t_C, ...]}, and prints one JSON answer:
  {"iapwsVersion": ..., "water": [{"density": kg/m3, "viscosity": Pa s, "vapourPressure": Pa}, ...]}
density and viscosity from IAPWS-95 (with the IAPWS 2008 viscosity) at 101.325 kPa, the
saturation pressure from IAPWS-95 saturated liquid.
"""
import json
import sys

import iapws
from iapws import IAPWS95


def water(t):
    liquid = IAPWS95(T=t + 273.15, P=0.101325)
    saturated = IAPWS95(T=t + 273.15, x=0)
    return {"density": liquid.rho, "viscosity": liquid.mu, "vapourPressure": saturated.P * 1e6}


request = json.load(sys.stdin)
json.dump({"iapwsVersion": iapws.__version__, "water": [water(t) for t in request["temperatures"]]}, sys.stdout)
