"""Reports: every page of the sheet (registered in one page list), the drawing helpers they
share, the tune figure, the writers of tables and fields, and the LAS export.

May import: the science stages (fault, layers, clay, io) and the root modules; never run or
the CLI.  Drawing only draws: pages return matplotlib Figures, the writers save them.
"""
