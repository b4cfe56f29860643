"""Reference values from python3-fluids for the hydraulics tests.

Reads one JSON request on stdin and prints one JSON answer on stdout:
  {"colebrook": [[Re, eD], ...],          -> Colebrook(Re, eD) (exact solution)
   "swameeJain": [[Re, eD], ...],         -> Swamee_Jain_1976(Re, eD)
   "pipes": [[schedule, NPS], ...],       -> nearest_pipe(NPS=, schedule=) as [Di, Do] in m
   "crane": [D, ...],                     -> Crane K values at each inside diameter D (m)
   "frictionFactor": [[Re, eD], ...],     -> friction_factor(Re, eD) (fluids' default, Clamond)
   "diameterChanges": [[beta, angle], ...]} -> contraction_conical and diffuser_conical, method
                                              'Crane', K of the small bore (sudden at 180 degrees)
"""
import json
import sys

import fluids
from fluids import fittings
from fluids.friction import Colebrook, Swamee_Jain_1976, friction_factor
from fluids.piping import nearest_pipe


def crane_values(D):
    return {
        "ft": fittings.ft_Crane(D),
        "elbow90": fittings.bend_rounded(Di=D, angle=90.0, method="Crane standard"),
        "elbow45": fittings.bend_rounded(Di=D, angle=45.0, method="Crane standard"),
        "return180": fittings.bend_rounded(Di=D, angle=180.0, method="Crane standard"),
        "bend90rd1": fittings.bend_rounded_Crane(Di=D, angle=90.0, rc=D),
        "bend90rd15": fittings.bend_rounded_Crane(Di=D, angle=90.0, rc=1.5 * D),
        "liftCheckInline": fittings.K_lift_check_valve_Crane(D1=D, D2=D, angled=False),
        "plugThreeWayRun": fittings.K_plug_valve_Crane(D1=D, D2=D, angle=0.0, style=1),
        "plugThreeWayBranch": fittings.K_plug_valve_Crane(D1=D, D2=D, angle=0.0, style=2),
        "teeAsElbow": fittings.K_branch_diverging_Crane(D_run=D, D_branch=D, Q_run=0.0, Q_branch=1e-3, angle=90),
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
    answer["frictionFactor"] = [friction_factor(Re, eD) for Re, eD in request.get("frictionFactor", [])]
    answer["diameterChanges"] = [
        {
            "contraction": fittings.contraction_conical(Di1=1.0, Di2=beta, angle=angle, method="Crane"),
            "enlargement": fittings.diffuser_conical(Di1=beta, Di2=1.0, angle=angle, method="Crane"),
        }
        for beta, angle in request.get("diameterChanges", [])
    ]
    json.dump(answer, sys.stdout)


if __name__ == "__main__":
    main()
