package catalog

// StarterFile is a commented user catalog that documents every key. It loads
// and lints clean; `whichreg catalog init` writes it.
const StarterFile = `# A user catalog for whichreg. Load it with --catalog FILE, or put it in
# the whichreg/catalog/ folder of your configuration directory. A family with
# the same id as a built-in one replaces it; 'whichreg catalog show ID' says
# which file each entry came from. Check it with 'whichreg catalog check FILE'.
#
# Every value should come from the maker's datasheet: name it in 'source'.
# Use worst-case figures (maximum quiescent current, highest dropout).

# An outline is only needed for a package the built-in catalog lacks.
[[outline]]
name = "TO-220-ISO-EXAMPLE"     # trade name
aliases = []                    # other names it is sold under
leads = 3                       # leads, not counting tab or can
pitch_mm = 2.54                 # centre to centre of adjacent leads
hole_spacing_mm = 0             # between two mounting holes (cans); 0 = none
tab = false                     # a metal tab or pad
metal_can = false               # a metal can (TO-3, TO-39)
round_can = false               # a round can with leads on a circle (TO-39)
mounting_hole = true            # a hole for a screw (TO-220, TO-3); never on SMD outlines
case_terminal = false           # the can is the third terminal (TO-3, TO-66)
isolated = true                 # no exposed metal
commonness = 2                  # 1 rare ... 5 everywhere: shares a family's prior among packages
smd = false                     # surface mount
view = "marked face toward you, leads down: 1-2-3 from the left"
source = "maker's package drawing, title and revision"

[[family]]
id = "my-7805-variant"          # generic designation, no maker prefix
title = "positive fixed, 1 A, isolated package"
polarity = "positive"           # positive | negative
kind = "fixed"                  # fixed | adjustable | non-regulator (a look-alike, never a replacement)
device = ""                     # non-regulator only: npn | pnp | npn-darlington | pnp-darlington | nmos | pmos | shunt-ref | buck
control_drop_v = []             # transistors only: [low, high] conducting B-E or G-S drop, volts
pass = "npn"                    # npn | npn-ldo | pnp | pmos | switching
outputs_v = [5]                 # fixed: the standard voltages (magnitudes)
vref_v = 0                      # adjustable: OUT minus ADJ, volts
vout_max_v = 0                  # adjustable: highest output, volts
tolerance = 0.05                # fraction, over line, load and temperature (4.75-5.25 V: 0.05)
tolerance_25c = 0.04            # the tighter figure at 25 C, if the datasheet gives one
current_a = 1.0                 # rated output current, amperes
vin_max_v = 35                  # fixed: absolute maximum input, volts
vin_max_high_v = 0              # fixed: the limit of the higher-voltage members
vin_max_high_from_v = 0         # ... from this output voltage up
transient_max_v = 0             # fixed: a rated surge (load dump) above vin_max_v; 0 = none
vdiff_max_v = 0                 # adjustable: maximum input-output differential
dropout_v = 2.0                 # worst-case input-output difference at rated current
iq_ma = 8.0                     # fixed: ground-lead current, maximum, mA
iq_typ_ma = 5.0                 # typical ground-lead current, mA
iadj_ua = 0                     # adjustable: ADJ current, maximum, uA
iadj_typ_ua = 0                 # adjustable: ADJ current, typical, uA
min_load_ma = 0                 # least load for regulation, mA
tj_max_c = 125                  # maximum operating junction temperature
efficiency = 0                  # switching modules only
cout = { min_uf = 0, esr_min_ohm = 0, esr_max_ohm = 0, ceramic_ok = true, max_uf = 0 }
status = "active"               # active | obsolete | scarce
since = 1980                    # year introduced; 0 = unknown
commonness = 3                  # 1 rare ... 5 everywhere
markings = ["*MY78{VV}*"]       # ? one character, * any run, {VV} the voltage code
# The voltage code {VV} is the output as the 78xx makers print it: two digits
# of whole volts ("05" = 5 V, "12" = 12 V), or the digits without the point
# below 10 V ("33" = 3.3 V, "85" = 8.5 V). "18" therefore reads as 18 V or
# 1.8 V, and 'catalog check' notes a family where that happens. Families that
# print volts x 10 (LF50 = 5.0 V, HT7333 = 3.3 V) spell their markings out
# instead of using {VV}.
source = "datasheet title, maker and revision"
notes = []
  [[family.package]]
  outline = "TO-220-ISO-EXAMPLE"
  variant = ""                  # names the pinout when a family has two on one outline
  source = ""                   # this variant's own datasheet (required with variant)
  pins = ["IN", "GND", "OUT"]   # lead 1..n: IN OUT GND ADJ NC EN SENSE FB PG BYP INH; look-alikes: SW B C E G D S REF A K
  tab = "none"                  # what the tab or can is tied to, or "none"
  theta_jc = 5.0                # junction to case, C/W
  theta_ja = 60.0               # junction to ambient in free air, C/W
  current_a = 0                 # 0 = the family's rating
  status = ""                   # "" = the family's status
  note = ""
  order_codes = []              # current order codes from the makers' ordering tables, e.g. ["L7805CV"]
`
