"""Running a screening: the settings and settings files, the one-well pipeline (the order
of the stages), batches over folders, well pairs and the blocking sweep.

May import: every stage and :mod:`logprep.report`; never the CLI.
"""
