"""Reference values from python3-fluids for the hydraulics tests.

Reads one JSON request on stdin and prints one JSON answer on stdout:
  {"colebrook": [[Re, eD], ...],          -> Colebrook(Re, eD) (exact solution)
   "swameeJain": [[Re, eD], ...],         -> Swamee_Jain_1976(Re, eD)
   "pipes": [[schedule, NPS], ...],       -> nearest_pipe(NPS=, schedule=) as [Di, Do] in m
   "crane": [D, ...]}                     -> Crane K values at each inside diameter D (m)
"""
import json
import sys

import fluids
from fluids import fittings
from fluids.friction import Colebrook, Swamee_Jain_1976
from fluids.piping import nearest_pipe


def crane_values(D):
    return {
        "ft": fittings.ft_Crane(D),
        "elbow90": fittings.bend_rounded(Di=D, angle=90.0, method="Crane standard"),
        "elbow45": fittings.bend_rounded(Di=D, angle=45.0, method="Crane standard"),
        "return180": fittings.bend_rounded(Di=D, angle=180.0, method="Crane standard"),
        "bend90rd1": fittings.bend_rounded_Crane(Di=D, angle=90.0, rc=D),
        "gate": fittings.K_gate_valve_Crane(D1=D, D2=D, angle=0.0),
        "ball": fittings.K_ball_valve_Crane(D1=D, D2=D, angle=0.0),
        "globe": fittings.K_globe_valve_Crane(D1=D, D2=D),
        "butterfly": fittings.K_butterfly_valve_Crane(D=D, style=0),
        "swingCheck": fittings.K_swing_check_valve_Crane(D=D, angled=True),
        "swingCheckClearway": fittings.K_swing_check_valve_Crane(D=D, angled=False),
        "footValvePoppet": fittings.K_foot_valve_Crane(D=D, style=0),
        "footValveHinged": fittings.K_foot_valve_Crane(D=D, style=1),
        "entranceSharp": fittings.entrance_sharp(method="Crane"),
        "entranceInward": fittings.entrance_distance(Di=D, t=0.01 * D, l=D, method="Crane"),
        "exit": fittings.exit_normal(),
    }


def main():
    request = json.load(sys.stdin)
    answer = {"fluidsVersion": fluids.__version__}
    answer["colebrook"] = [Colebrook(Re, eD) for Re, eD in request.get("colebrook", [])]
    answer["swameeJain"] = [Swamee_Jain_1976(Re, eD) for Re, eD in request.get("swameeJain", [])]
    pipes = []
    for schedule, nps in request.get("pipes", []):
        _, Di, Do, _ = nearest_pipe(NPS=nps, schedule=schedule)
        pipes.append([Di, Do])
    answer["pipes"] = pipes
    answer["crane"] = [crane_values(D) for D in request.get("crane", [])]
    json.dump(answer, sys.stdout)


if __name__ == "__main__":
    main()
