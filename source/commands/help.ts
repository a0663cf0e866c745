/** Help text of each command, shown by `--help`. Kept beside the dispatcher so they stay true. */
export const helpTexts = {
	main: `prelase — pre-energize bench check for laser diodes on drivers

Usage:
  prelase check --answers FILE [--rules FILE] [--json]
  prelase calc [NAME key=value ... [--json]]
  prelase rules schema
  prelase rules validate FILE...
  prelase --help | --version

Commands:
  check    Run the bench check over the rule file and report each check's verdict and margin
  calc     Run one bench calculation (dissipation, headroom, wire, ...) on values with units
  rules    Print the rule file JSON Schema, or validate rule files

Every command takes --help. NO_COLOR turns colour off.
The shipped bench policy is rules/default.yaml; --rules FILE uses a site policy instead.

prelase says which checks held; it never says a setup is safe. The laser safety officer and
the codes in force (IEC 60825 series, ANSI Z136 series, local law) have the final word.`,
	check: `prelase check — the bench check

Usage:
  prelase check --answers FILE [--rules FILE] [--json]

Reads the setup's numbers and confirmations from an answers file (YAML), evaluates every
check of the rule file, and prints each verdict with its value, limit and margin, failures
first in the summary, then the outcome: clear to energize, do not energize, or incomplete.

Options:
  --answers FILE   Answers file: setup, inputs (id: value with unit), confirmations (id: yes/no/
                   not applicable, or {answer, note}); see docs/examples/
  --rules FILE     Rule file to use (default: the shipped rules/default.yaml)
  --json           Print the evaluation as JSON instead of text
  -h, --help       Show this help

Exit status:
  0  clear to energize
  1  do not energize, or incomplete
  2  bad usage or bad input (the message names the file, line and field)

The on-screen check is not in this version; use --answers FILE.`,
	calc: `prelase calc — bench calculations

Usage:
  prelase calc                            List the calculations
  prelase calc NAME --help                Inputs (dimension, description, default), outputs, basis
  prelase calc NAME key=value ... [--json]

Values carry units: prelase calc dissipation supply=28V knee=2V series_resistance=0ohm limit=1A
Temperatures in degC; percentages as 5%. Rule formulas call the same calculations.

--json prints {"calc", "inputs", "outputs": {KEY: {"si", "unit", "text"}}, "notes", "basis"}
and, for mpe, nohd, od and hazard-class, "caution": these are for planning and do not replace
the laser safety officer's hazard evaluation or the standards in force.
Exit status: 0 done, 2 unknown name or key, wrong dimension, missing input, or a value
outside the calculation's validity.`,
	rules: `prelase rules — rule files

Usage:
  prelase rules schema              Print the JSON Schema of rule files (for editors)
  prelase rules validate FILE...    Load, lint and report every problem with file:line:column

Exit status for validate: 0 no problems, 1 problems found, 2 bad usage.`,
} as const;
