"""The caution printed on every sheet and in the README."""

CAUTION = (
    "Screening estimate only, not a full fault-seal study. Vshale, layers, juxtapositions and "
    "SGR come from one well's logs and published transforms and calibrations; calibrate them to "
    "local core, pressure and production data. Decisions on wells and storage sites must defer "
    "to local regulations and licensed professional judgement."
)
