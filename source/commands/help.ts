/** Help text of each command, shown by `--help`. Kept beside the dispatcher so they stay true. */
export const helpTexts = {
	main: `prelase — pre-energize bench check for laser diodes on drivers

Usage:
  prelase check --answers FILE [--rules FILE] [--json]
  prelase calc [NAME key=value ... [--json]]
  prelase rules schema
  prelase rules validate FILE...
  prelase keys [export | trust FILE --name NAME | list | forget NAME]
  prelase --help | --version

Commands:
  check    Run the bench check over the rule file and report each check's verdict and margin
  calc     Run one bench calculation (dissipation, headroom, wire, ...) on values with units
  rules    Print the rule file JSON Schema, or validate rule files
  keys     Your signing key, and the colleagues' keys you trust

Every command takes --help. NO_COLOR turns colour off.
The shipped bench policy is rules/default.yaml; --rules FILE uses a site policy instead.

prelase says which checks held; it never says a setup is safe. The laser safety officer and
the codes in force (IEC 60825 series, ANSI Z136 series, local law) have the final word.`,
	check: `prelase check — the bench check

Usage:
  prelase check --answers FILE [--rules FILE] [--json]
                [--sign NAME [--role ROLE] [--records DIR] [--amends RECORD --reason TEXT]
                 [--cosign NAME --cosign-key FILE [--cosign-role ROLE] [--cosign-meaning verified|approved]]]

Reads the setup's numbers and confirmations from an answers file (YAML), evaluates every
check of the rule file, and prints each verdict with its value, limit and margin, failures
first in the summary, then the outcome: clear to energize, do not energize, or incomplete.

Options:
  --answers FILE   Answers file: setup, inputs (id: value with unit), confirmations (id: yes/no/
                   not applicable, or {answer, note}); see docs/examples/
  --rules FILE     Rule file to use (default: the shipped rules/default.yaml)
  --json           Print the evaluation as JSON instead of text
  --sign NAME      Write a signed record of this check (in every outcome) as NAME; the
                   operator's key is created on first use (see prelase keys)
  --role ROLE      The signer's role (default: the role in settings)
  --records DIR    Folder for the record (default: settings, else the settings folder's records/)
  --amends RECORD  This record corrects RECORD (never edited); needs --reason TEXT
  --cosign NAME    A second signer (verifier or laser safety officer) signing with their own
                   private key file --cosign-key FILE; --cosign-meaning verified (default) or approved
  -h, --help       Show this help

Without --sign nothing is written.

Exit status:
  0  clear to energize
  1  do not energize, or incomplete
  2  bad usage or bad input (the message names the file, line and field)

The on-screen check is not in this version; use --answers FILE.`,
	keys: `prelase keys — signing keys

Usage:
  prelase keys                          Show your key's fingerprint (create the key on first use)
  prelase keys export                   Print your public key (PEM) to give to colleagues
  prelase keys trust FILE --name NAME   Trust a colleague's public key (PEM file)
  prelase keys list                     List your key and the keys you trust
  prelase keys forget NAME              Stop trusting a colleague's key

Keys live in the settings folder (PRELASE_HOME overrides it), readable only by you; a private
key file that others can read is refused.`,
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
