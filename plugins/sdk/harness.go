package sdk

import (
	"testing"

	"github.com/hashicorp/go-plugin"
)

// TestRig serves r in-process over go-plugin's real gRPC transport and
// returns the host-side client shim, so a rig's tests exercise the same
// protobuf conversion and answer checks a plugin subprocess would, without
// building an executable. The connection is closed when the test ends.
func TestRig(t testing.TB, r Rig) Rig {
	t.Helper()
	client, _ := plugin.TestPluginGRPCConn(t, false, map[string]plugin.Plugin{
		PluginName: &RigPlugin{Impl: r},
	})
	// Closing the client asks the server, through go-plugin's controller
	// service, to stop; stopping it here as well would race with that.
	t.Cleanup(func() { _ = client.Close() })
	raw, err := client.Dispense(PluginName)
	if err != nil {
		t.Fatalf("sdk.TestRig: dispense %q: %v", PluginName, err)
	}
	rig, ok := raw.(Rig)
	if !ok {
		t.Fatalf("sdk.TestRig: dispensed %T, want an sdk.Rig", raw)
	}
	return rig
}
