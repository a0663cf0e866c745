/** Help text of each command, shown by `--help`. Kept beside the dispatcher so they stay true. */
export const helpTexts = {
	main: `prelase — pre-energize bench check for laser diodes on drivers

Usage:
  prelase check --answers FILE [--rules FILE] [--json]
  prelase calc [NAME key=value ... [--json]]
  prelase rules init FILE | validate FILE... | show [FILE] | diff A B | schema
  prelase keys [export | trust FILE --name NAME | list | forget NAME]
  prelase report RECORD [--format md|html] [--out FILE]
  prelase audit PATH... [--rules FILE] [--json]
  prelase plan FILE [--json | --test-sheet md|html | --record-test RESULTS | --edit]
  prelase --help | --version

Commands:
  check    Run the bench check over the rule file and report each check's verdict and margin
  calc     Run one bench calculation (dissipation, headroom, wire, ...) on values with units
  rules    Site policy: derive, validate, show and compare rule files; the JSON Schema
  keys     Your signing key, and the colleagues' keys you trust
  report   A printable page (Markdown or HTML) of a signed record
  audit    Check signed records: authentic, consistent, and what the current rules change
  plan     Analyse an interlock loop plan, print its test sheet, record a test, edit it

Every command takes --help. NO_COLOR turns colour off.
The shipped bench policy is rules/default.yaml; --rules FILE uses a site policy instead.

prelase says which checks held; it never says a setup is safe. The laser safety officer and
the codes in force (IEC 60825 series, ANSI Z136 series, local law) have the final word.`,
	check: `prelase check — the bench check

Usage:
  prelase check --answers FILE [--rules FILE] [--json] [--records DIR]
                [--sign NAME [--role ROLE] [--amends RECORD --reason TEXT]
                 [--cosign NAME --cosign-key FILE [--cosign-role ROLE] [--cosign-meaning verified|approved]]]

Reads the setup's numbers and confirmations from an answers file (YAML), evaluates every
check of the rule file, and prints each verdict with its value, limit and margin, failures
first in the summary, then the outcome: clear to energize, do not energize, or incomplete.
When the setup names its interlock plan (input interlock_plan, a path relative to the answers
file), the loop-test confirmations are answered from the latest trusted interlock test record
of that plan in the records folder: yes within the policy's test interval, otherwise no.

Options:
  --answers FILE   Answers file: setup, inputs (id: value with unit), confirmations (id: yes/no/
                   not applicable, or {answer, note}); see docs/examples/
  --rules FILE     Rule file to use (default: the settings' rule file, else the shipped
                   rules/default.yaml)
  --json           Print the evaluation as JSON instead of text
  --sign NAME      Write a signed record of this check (in every outcome) as NAME; the
                   operator's key is created on first use (see prelase keys)
  --role ROLE      The signer's role (default: the role in settings)
  --records DIR    Records folder: where the record is written and interlock test records are
                   looked for (default: settings, else the settings folder's records/)
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
	audit: `prelase audit — check signed records

Usage:
  prelase audit PATH... [--rules FILE] [--json]

PATH is a record file or a folder of records (searched recursively; dotfiles and *.tmp are
left out). For each record the audit checks:
  integrity      it parses and every signature verifies over its body; who signed, in what
                 role and meaning, and whether each key is yours or one you trust
                 (prelase keys trust); an untrusted key is a finding
  consistency    its inputs, re-evaluated under the rule file embedded in it, give every
                 recorded value, verdict and the outcome (a difference is a finding: the
                 record's conclusions do not follow from its numbers)
  current rules  what would change under the site's current rules: verdicts, the outcome,
                 inputs and confirmations the record lacks (a changed verdict is a finding)
  history        amendments and the records they correct, a later record for the same
                 setup fingerprint, a setup whose fingerprint changed since its last record
Record age and interlock test dates are reported as not checked: rule files set no
validity period or test interval yet.

Options:
  --rules FILE   The current rules (default: the rulesFile setting, else the shipped
                 rules/default.yaml)
  --json         Print everything the audit found as JSON
  -h, --help     Show this help

Exit status:
  0  every record is authentic and consistent, with no findings
  1  every record is authentic, with findings
  2  bad usage (no PATH, a PATH that does not exist, a current rule file with problems)
  3  integrity failure in a record (altered, unsigned or unreadable)

The audit says whether a record is authentic and whether its conclusions follow from its
numbers; it never says a setup is safe. The laser safety officer has the final word.`,
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
  prelase rules init FILE           Write a site rule file that extends the shipped policy, with
                                    every policy value, its default, unit and meaning commented
                                    out; never overwrites a file
  prelase rules validate FILE...    Load, resolve extends, lint and report every problem with
                                    file:line:column
  prelase rules show [FILE] [--json]
                                    The effective rules step by step: inputs, confirmations,
                                    checks with their condition, severity and basis, policy
                                    values, switched-off checks with reasons, and the file each
                                    part came from (default: the rule file in force, from
                                    settings, else the shipped policy)
  prelase rules diff A B [--json]   What differs in meaning from A to B: policy values (old →
                                    new), checks added, removed, switched off or changed,
                                    inputs and confirmations added or removed
  prelase rules schema [--site]     Print the JSON Schema of rule files (--site: of site rule
                                    files, those with extends), for editors

FILE may be "shipped" for the shipped policy. A site rule file names its base with
extends: shipped (or a path relative to itself) and lists only what it changes; see
docs/rule-file.md. The laser safety officer decides the site policy.

Exit status:
  validate  0 no problems, 1 problems found, 2 bad usage
  diff      0 no differences in meaning, 1 differences, 2 bad usage or a file with problems
  init, show, schema  0 done, 2 bad usage (init: the file exists)`,
	report: `prelase report — a printable page of a record

Usage:
  prelase report RECORD [--format md|html] [--out FILE]

Checks the record's integrity, then prints it: the outcome, the caution and the deferral,
failures first in a summary, the setup and its fingerprint, operator and time, the rule
file's name and SHA-256, every input, every check by step with verdict, value, limit and
margin, confirmations with notes, and each signature with whether it verifies and whether
its key is yours or one you trust (prelase keys). An interlock test record (prelase plan
--record-test) prints its outcome, steps not passed first, the tester and witness, the plan and
its SHA-256, the policy, every step with its result, stop time and note, and the signatures.

Options:
  --format md|html  Markdown (default), or one self-contained HTML file that prints on A4
                    and Letter (default html when --out ends in .html)
  --out FILE        Write the page to FILE instead of printing it; an existing FILE is
                    never overwritten
  -h, --help        Show this help

Exit status:
  0  the report was printed or written
  2  bad usage (no RECORD, unknown format, FILE exists)
  3  the record fails its integrity check (altered, unsigned, unreadable); nothing is printed`,
	plan: `prelase plan — the interlock planner

Usage:
  prelase plan FILE [--rules FILE] [--json]
  prelase plan FILE --test-sheet md|html
  prelase plan FILE --record-test RESULTS [--records DIR] [--witness-key FILE]
  prelase plan FILE --edit
  prelase plan --schema plan|results

Reads an interlock plan (YAML: the driver's interlock input, the access points and the devices
of the loop in wiring order; see docs/interlock.md) under the interlock policy of the rule file
in force (interlock_* policy values), and prints the loop figures and every finding with its
severity and the device or access point it concerns:
  loop        contacts plus every wire run (copper at the stated temperature) against the
              input's closed threshold less the policy margin; loop current and voltage
              against every contact's rating
  fail-safe   every device normally closed and in series; emergency stops positive-opening;
              a bypass key or shorting plug allowed by policy, with owner, reason and time limit
  coverage    every access point a beam can be reached through is interlocked or tool-secured,
              by a device that exists
  response    each device's opening time + input response + driver disable and fall time
              within the policy's largest response time; manual reset for class 4

Options:
  --rules FILE           The rule file whose interlock policy applies (default: the settings'
                         rule file, else the shipped policy)
  --json                 Print the figures, findings and verdict as JSON
  --test-sheet md|html   Print the functional test sheet (Markdown, or a page to print) with
                         blanks for the result, initials and date of every step
  --record-test RESULTS  Hold a filled-in test (YAML: tested_on, tested_by, witness, one result
                         per step) against the plan's sheet, then write a signed interlock test
                         record with the plan's text and hash. A bench check whose setup names
                         the plan (input interlock_plan) answers its loop-test confirmations
                         from the latest such record within the policy's test interval
  --records DIR          Where to write the record (default: the settings' records folder)
  --witness-key FILE     The witness's private key: the witness signs too, as verified
  --edit                 Open the planner screen on FILE (needs a terminal): edit, add, remove
                         and reorder access points and devices, the findings following each
                         change; saving keeps the file's comments and key order; t records a
                         functional test of the plan as saved, step by step
  --schema plan|results  Print the JSON Schema of plan files or of results files
  -h, --help             Show this help

Exit status:
  0  no stop finding (or the test sheet or schema was printed; or the test recorded passed)
  1  one or more stop findings (or the test recorded failed: the record is written anyway)
  2  bad usage, a bad plan or results file (the message names the file, line and field);
     nothing is recorded

The planner says which findings it has; it never says a loop is safe. The laser safety
officer and the codes in force (IEC 60825 series, ANSI Z136 series, local law) decide.`,
} as const;
