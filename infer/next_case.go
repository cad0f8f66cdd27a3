package infer

import (
	"fmt"

	"github.com/whichreg/whichreg/catalog"
)

// caseTerminalAsks offers, when a leader's can is a terminal of its own
// (a two-lead TO-3 or TO-66), where the can goes on the board and what it
// reads: on such a part the can is the third terminal (the output of a
// 317, the ground of a 7805, a transistor's collector), so these readings
// say as much as a lead's.
func caseTerminalAsks(ev *Evidence, sc askScope) []measurement {
	if !sc.terminal {
		return nil
	}
	var ms []measurement
	// The ohmmeter first: a powered probe on a can that may be live, often
	// reached only through a mounting screw behind a bracket, is offered
	// once the power-off answer is in, and only when the can goes to a
	// network: on a rail (ground, load, unregulated) it reads that rail,
	// which a probe anywhere on the rail reads as well (common practice, no
	// source).
	switch cs := ev.Case; {
	case cs == nil || cs.WiredTo == "":
		ms = append(ms, caseWiredAsk(sc))
	case !cs.Volts.Set && cs.WiredTo == WiredNetwork:
		ms = append(ms, caseVoltsAsk(ev, sc))
	}
	return ms
}

// caseFn is the function of h's tab or can, "" when it carries none.
func caseFn(h Hypothesis) string {
	if h.Package.Tab == catalog.TabNone || h.Package.Tab == "" {
		return ""
	}
	return h.Package.Tab
}

func caseWiredAsk(sc askScope) measurement {
	words := make([]string, len(wirings.words))
	for i, w := range wirings.words {
		words[i] = string(w)
	}
	return measurement{
		Measurement: Measurement{
			Key: "case.wired_to", Kind: AskChoice, Choices: words,
			Measure: "where the can goes on the board (ohmmeter, power off)",
			Prompt: join(discharged, sc.view, "The can of a two-lead metal part is its third terminal, often reached through a mounting screw or a solder tag. "+
				"Follow it with an ohmmeter and write where it goes: 'unregulated' (the + of the main filter capacitor), 'load' (the regulated rail), "+
				"'ground', 'network' (a resistor, trimmer, zener or diodes), or 'open' (insulated and tied to nothing)."),
		},
		predict: func(h Hypothesis) outcomeDist {
			fn := caseFn(h)
			if fn == "" {
				return outcomeDist{string(WiredOpen): 1}
			}
			return wiringDist(h.Family, fn)
		},
		describe: func(key string) string { return "can to " + key },
	}
}

func caseVoltsAsk(ev *Evidence, sc askScope) measurement {
	return measurement{
		Measurement: Measurement{
			Key: "case.volts", Kind: AskNumber, Unit: "V", Powered: true,
			Measure: "DC volts on the can to board ground (powered)",
			Prompt: join(sc.view, "Power on, at normal load. Meter on DC volts: black lead on board ground (the − side of the main filter capacitor), "+
				"red lead on the can or a mounting screw that touches it. Write the reading with its sign. The can may be live: touch nothing else."),
		},
		predict: func(h Hypothesis) outcomeDist {
			fn := caseFn(h)
			if fn == "" {
				return outcomeDist{"nothing steady (an insulated can floats)": 1}
			}
			return railDist(h, ev.Case.WiredTo, fn, terminalVolts(h, ev))
		},
		describe: func(key string) string { return fmt.Sprintf("the can reads %s", key) },
	}
}
