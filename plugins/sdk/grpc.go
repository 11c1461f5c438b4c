package sdk

import (
	"context"
	"errors"
	"fmt"
	"sync"
	"time"

	"google.golang.org/grpc/codes"
	"google.golang.org/grpc/status"

	"github.com/rigmix/rigmix/plugins/proto"
)

// grpcServer is the plugin-side shim: it receives gRPC calls and hands them
// to the rig being served, with the caller's context (so the host's
// deadline and cancellation reach the rig).
type grpcServer struct {
	proto.UnimplementedRigServer
	impl Rig
}

func (s *grpcServer) Describe(ctx context.Context, _ *proto.DescribeRequest) (*proto.RigInfo, error) {
	info, err := s.impl.Describe(ctx)
	if err != nil {
		return nil, err
	}
	return infoToProto(info), nil
}

func (s *grpcServer) Assess(ctx context.Context, req *proto.AssessRequest) (*proto.AssessResponse, error) {
	in := AssessRequest{}
	for _, site := range req.GetSites() {
		in.Sites = append(in.Sites, siteFromProto(site))
	}
	resp, err := s.impl.Assess(ctx, in)
	if err != nil {
		return nil, err
	}
	out := &proto.AssessResponse{}
	for _, a := range resp.Answers {
		out.Answers = append(out.Answers, answerToProto(a))
	}
	return out, nil
}

func (s *grpcServer) Mobilize(ctx context.Context, req *proto.MobilizeRequest) (*proto.MobilizeResponse, error) {
	resp, err := s.impl.Mobilize(ctx, MobilizeRequest{DistanceMi: req.GetDistanceMi()})
	if err != nil {
		return nil, err
	}
	return &proto.MobilizeResponse{Hours: resp.Hours, Quantities: quantitiesToProto(resp.Quantities)}, nil
}

func (s *grpcServer) Moves(ctx context.Context, req *proto.MovesRequest) (*proto.MovesResponse, error) {
	in := MovesRequest{}
	for _, l := range req.GetLegs() {
		in.Legs = append(in.Legs, legFromProto(l))
	}
	resp, err := s.impl.Moves(ctx, in)
	if err != nil {
		return nil, err
	}
	return &proto.MovesResponse{Hours: resp.Hours}, nil
}

// grpcClient is the host-side shim: an sdk.Rig that forwards each call over
// gRPC and checks what comes back, because a plugin is code we did not
// write. Errors name the rig (by the name its Describe gave, once known).
type grpcClient struct {
	client proto.RigClient

	mu   sync.Mutex
	name string
	info *RigInfo // what Describe gave, once called
}

var _ Rig = (*grpcClient)(nil)

func (c *grpcClient) rigName() string {
	c.mu.Lock()
	defer c.mu.Unlock()
	if c.name == "" {
		return "(not yet described)"
	}
	return c.name
}

// callError turns a gRPC status error back into a plain error carrying the
// rig's own message. When the caller's context ended, the context's error is
// wrapped so errors.Is(err, context.DeadlineExceeded) works.
//
// The deadline travels with the call, so the plugin's side may give up a
// moment before the caller's context ends and reset the stream: a
// cancelled call within a moment of the caller's deadline is reported as
// the deadline. A broken connection (the plugin process ended, most
// likely) wraps ErrConnectionLost.
func (c *grpcClient) callError(ctx context.Context, call string, err error) error {
	if ctxErr := ctx.Err(); ctxErr != nil {
		return fmt.Errorf("rig %q: %s: %w", c.rigName(), call, ctxErr)
	}
	if st, ok := status.FromError(err); ok {
		dl, hasDL := ctx.Deadline()
		switch {
		case st.Code() == codes.DeadlineExceeded,
			st.Code() == codes.Canceled && hasDL && time.Until(dl) < deadlineSlack:
			return fmt.Errorf("rig %q: %s: %w", c.rigName(), call, context.DeadlineExceeded)
		case st.Code() == codes.Unavailable:
			return fmt.Errorf("rig %q: %s: %w (%s)", c.rigName(), call, ErrConnectionLost, st.Message())
		}
		return fmt.Errorf("rig %q: %s: %s", c.rigName(), call, st.Message())
	}
	return fmt.Errorf("rig %q: %s: %w", c.rigName(), call, err)
}

// deadlineSlack is how close to the caller's deadline a cancelled call
// counts as timed out: clocks of the two processes and the scheduling of
// their timers differ by far less (our own choice).
const deadlineSlack = 250 * time.Millisecond

// ErrConnectionLost is wrapped by a call's error when the connection to
// the plugin broke during the call, which usually means the plugin process
// ended (it crashed, panicked or was killed).
var ErrConnectionLost = errors.New("connection to the rig plugin lost")

func (c *grpcClient) Describe(ctx context.Context) (RigInfo, error) {
	resp, err := c.client.Describe(ctx, &proto.DescribeRequest{})
	if err != nil {
		return RigInfo{}, c.callError(ctx, "describe", err)
	}
	info := infoFromProto(resp)
	if err := CheckInfo(info); err != nil {
		return RigInfo{}, err
	}
	c.mu.Lock()
	c.name = info.Name
	c.info = &info
	c.mu.Unlock()
	return info, nil
}

func (c *grpcClient) Assess(ctx context.Context, req AssessRequest) (AssessResponse, error) {
	in := &proto.AssessRequest{}
	for _, s := range req.Sites {
		in.Sites = append(in.Sites, siteToProto(s))
	}
	resp, err := c.client.Assess(ctx, in)
	if err != nil {
		return AssessResponse{}, c.callError(ctx, "assess", err)
	}
	out := AssessResponse{}
	for _, a := range resp.GetAnswers() {
		out.Answers = append(out.Answers, answerFromProto(a))
	}
	if err := CheckAssess(req, out); err != nil {
		return AssessResponse{}, fmt.Errorf("rig %q: assess: %w", c.rigName(), err)
	}
	c.mu.Lock()
	info := c.info
	c.mu.Unlock()
	if info != nil {
		if err := CheckAgainstInfo(*info, req, out); err != nil {
			return AssessResponse{}, fmt.Errorf("rig %q: assess: %w", c.rigName(), err)
		}
	}
	return out, nil
}

func (c *grpcClient) Mobilize(ctx context.Context, req MobilizeRequest) (MobilizeResponse, error) {
	resp, err := c.client.Mobilize(ctx, &proto.MobilizeRequest{DistanceMi: req.DistanceMi})
	if err != nil {
		return MobilizeResponse{}, c.callError(ctx, "mobilize", err)
	}
	out := MobilizeResponse{Hours: resp.GetHours(), Quantities: quantitiesFromProto(resp.GetQuantities())}
	if err := CheckMobilize(out); err != nil {
		return MobilizeResponse{}, fmt.Errorf("rig %q: mobilize: %w", c.rigName(), err)
	}
	return out, nil
}

func (c *grpcClient) Moves(ctx context.Context, req MovesRequest) (MovesResponse, error) {
	in := &proto.MovesRequest{}
	for _, l := range req.Legs {
		in.Legs = append(in.Legs, legToProto(l))
	}
	resp, err := c.client.Moves(ctx, in)
	if err != nil {
		return MovesResponse{}, c.callError(ctx, "moves", err)
	}
	out := MovesResponse{Hours: resp.GetHours()}
	if len(out.Hours) == 0 {
		out.Hours = nil
	}
	if err := CheckMoves(req, out); err != nil {
		return MovesResponse{}, fmt.Errorf("rig %q: moves: %w", c.rigName(), err)
	}
	return out, nil
}

// errNoName is returned for a RigInfo without a name.
var errNoName = errors.New("describe gave no rig name")
