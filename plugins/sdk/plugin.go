package sdk

import (
	"context"

	"github.com/hashicorp/go-plugin"
	"google.golang.org/grpc"

	"github.com/rigmix/rigmix/plugins/proto"
)

// PluginName is the one plugin a rig executable serves, the key of PluginMap.
const PluginName = "rig"

// HandshakeConfig must match between the host and every rig plugin. The
// magic cookie is not a secret: it only lets a rig executable started by
// hand say "run me from rigmix" instead of waiting on a socket. Raise
// ProtocolVersion when rig.proto changes incompatibly.
var HandshakeConfig = plugin.HandshakeConfig{
	ProtocolVersion:  1,
	MagicCookieKey:   "RIGMIX_RIG_PLUGIN",
	MagicCookieValue: "d6c1f3a2-rig-plugin-for-rigmix-8e4b",
}

// PluginMap is the plugin set of a rig executable: one plugin named "rig".
// The host dispenses it; Serve serves it.
var PluginMap = map[string]plugin.Plugin{
	PluginName: &RigPlugin{},
}

// RigPlugin is the go-plugin glue for a Rig over gRPC. On the plugin side
// Impl is the rig being served; on the host side Impl is unused.
type RigPlugin struct {
	plugin.NetRPCUnsupportedPlugin
	Impl Rig
}

var _ plugin.GRPCPlugin = (*RigPlugin)(nil)

// GRPCServer registers the server shim around Impl.
func (p *RigPlugin) GRPCServer(_ *plugin.GRPCBroker, s *grpc.Server) error {
	proto.RegisterRigServer(s, &grpcServer{impl: p.Impl})
	return nil
}

// GRPCClient returns the client shim, an sdk.Rig that checks every answer
// it gets back (see checkAssess).
func (p *RigPlugin) GRPCClient(_ context.Context, _ *plugin.GRPCBroker, c *grpc.ClientConn) (interface{}, error) {
	return &grpcClient{client: proto.NewRigClient(c)}, nil
}

// MaxMessageBytes bounds one gRPC message a rig plugin receives. gRPC's
// server default of 4 MiB would cap one Assess batch at some tens of
// thousands of sites, and the contract is one round trip per batch.
// (go-plugin's host side already accepts messages up to 2 GiB.)
const MaxMessageBytes = 256 << 20

// GRPCServer makes the plugin's gRPC server with a MaxMessageBytes receive
// limit; Serve uses it, and a rig that calls plugin.Serve itself should too.
func GRPCServer(opts []grpc.ServerOption) *grpc.Server {
	opts = append(opts, grpc.MaxRecvMsgSize(MaxMessageBytes), grpc.MaxSendMsgSize(MaxMessageBytes))
	return grpc.NewServer(opts...)
}

// Serve runs r as a rig plugin over go-plugin's gRPC protocol and returns
// when the host tells the plugin to stop. Call it from a rig executable's
// main; it needs the handshake cookie the host sets, and prints a short
// explanation and exits when started by hand.
func Serve(r Rig) {
	plugin.Serve(&plugin.ServeConfig{
		HandshakeConfig: HandshakeConfig,
		Plugins: map[string]plugin.Plugin{
			PluginName: &RigPlugin{Impl: r},
		},
		GRPCServer: GRPCServer,
	})
}
